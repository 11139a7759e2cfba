import { afterEach, describe, expect, it, vi } from 'vitest'
import { flushPromises, mount } from '@vue/test-utils'
import { createPinia } from 'pinia'
import { Notify, Quasar } from 'quasar'
import { createMemoryHistory, createRouter } from 'vue-router'
import SignInPage from '../../../src/pages/SignInPage.vue'

function jsonResponse(status: number, body: unknown): Response {
  return new Response(JSON.stringify(body), {
    status,
    headers: { 'Content-Type': 'application/json' },
  })
}

async function mountPage() {
  const router = createRouter({
    history: createMemoryHistory(),
    routes: [
      { path: '/sign-in', name: 'sign-in', component: SignInPage },
      { path: '/', name: 'home', component: { template: '<div>home</div>' } },
      {
        path: '/forgot-password',
        name: 'forgot-password',
        component: { template: '<div>forgot</div>' },
      },
    ],
  })
  await router.push('/sign-in')
  const wrapper = mount(SignInPage, {
    attachTo: document.body,
    global: {
      plugins: [[Quasar, { plugins: { Notify } }], createPinia(), router],
      // QPage must sit inside a QLayout; the page's own content is what is under test.
      stubs: { QPage: { template: '<div class="q-page-stub"><slot /></div>' } },
    },
  })
  return { wrapper, router }
}

type PageWrapper = Awaited<ReturnType<typeof mountPage>>['wrapper']

async function fillAndSubmit(wrapper: PageWrapper, email: string, password: string) {
  await wrapper.find('input[data-testid="sign-in-email"]').setValue(email)
  await wrapper.find('input[data-testid="sign-in-password"]').setValue(password)
  await wrapper.find('form').trigger('submit')
  await flushPromises()
}

/** Quasar puts data-testid on the native input and links its message through aria. */
function fieldMessage(wrapper: PageWrapper, testId: string): string {
  const input = wrapper.find(`input[data-testid="${testId}"]`)
  if (input.attributes('aria-invalid') !== 'true') return ''
  const messageId = input.attributes('aria-errormessage') ?? ''
  return wrapper.find(`[id="${messageId}"]`).text()
}

afterEach(() => {
  vi.unstubAllGlobals()
  document.body.innerHTML = ''
})

describe('SignInPage', () => {
  it('when the server answers VALIDATION_FAILED, then each field shows its own message', async () => {
    vi.stubGlobal(
      'fetch',
      vi.fn().mockResolvedValue(
        jsonResponse(400, {
          error: {
            code: 'VALIDATION_FAILED',
            message: 'Some fields need attention',
            fields: [
              { field: 'email', message: 'This address is not allowed to sign in here' },
              { field: 'password', message: 'The password is too long' },
            ],
          },
        }),
      ),
    )
    const { wrapper } = await mountPage()

    await fillAndSubmit(wrapper, 'someone@wendmoor-water.example', 'a-long-enough-password')

    expect(fieldMessage(wrapper, 'sign-in-email')).toBe(
      'This address is not allowed to sign in here',
    )
    expect(fieldMessage(wrapper, 'sign-in-password')).toBe('The password is too long')
  })

  it('when the e-mail is malformed, then it says so without asking the server', async () => {
    const fetchMock = vi.fn()
    vi.stubGlobal('fetch', fetchMock)
    const { wrapper } = await mountPage()

    await fillAndSubmit(wrapper, 'not-an-address', '')

    expect(fetchMock).not.toHaveBeenCalled()
    expect(fieldMessage(wrapper, 'sign-in-email')).toBe('Enter a valid e-mail address')
    expect(fieldMessage(wrapper, 'sign-in-password')).toBe('Enter your password')
  })

  it('when sign-in is rate limited, then it asks the user to wait', async () => {
    vi.stubGlobal(
      'fetch',
      vi
        .fn()
        .mockResolvedValue(
          jsonResponse(429, { error: { code: 'RATE_LIMITED', message: 'Too many requests' } }),
        ),
    )
    const { wrapper } = await mountPage()

    await fillAndSubmit(wrapper, 'someone@wendmoor-water.example', 'whatever-password')

    expect(wrapper.find('[data-testid="sign-in-message"]').text()).toContain('Wait a few minutes')
  })

  it('when the password is wrong, then it shows the server message and clears the password', async () => {
    vi.stubGlobal(
      'fetch',
      vi.fn().mockResolvedValue(
        jsonResponse(401, {
          error: { code: 'UNAUTHENTICATED', message: 'E-mail or password is not right' },
        }),
      ),
    )
    const { wrapper } = await mountPage()

    await fillAndSubmit(wrapper, 'someone@wendmoor-water.example', 'wrong-password-here')

    expect(wrapper.find('[data-testid="sign-in-message"]').text()).toBe(
      'E-mail or password is not right',
    )
    expect(
      (wrapper.find('input[data-testid="sign-in-password"]').element as HTMLInputElement).value,
    ).toBe('')
  })

  it('when sign-in succeeds, then it goes to the ?next= page', async () => {
    const user = {
      id: 1,
      email: 'someone@wendmoor-water.example',
      name: 'Some One',
      role: 'asset_engineer',
      active: true,
      organisation: {
        id: 3,
        name: 'Wendmoor Water',
        kind: 'network_owner',
        medium: 'water',
        createdAt: '',
      },
      lastSignInAt: null,
      createdAt: '',
    }
    vi.stubGlobal('fetch', vi.fn().mockResolvedValue(jsonResponse(200, { user })))
    const { wrapper, router } = await mountPage()
    await router.push('/sign-in?next=/')

    await fillAndSubmit(wrapper, 'someone@wendmoor-water.example', 'right-password-here')

    expect(router.currentRoute.value.name).toBe('home')
  })

  it('when the user forgot the password, then a link leads to the reset request', async () => {
    const { wrapper, router } = await mountPage()
    await wrapper.find('[data-testid="sign-in-forgot"]').trigger('click')
    await flushPromises()
    expect(router.currentRoute.value.name).toBe('forgot-password')
  })
})
