import { describe, expect, it } from 'vitest'
import { mount } from '@vue/test-utils'
import { Quasar } from 'quasar'
import { createMemoryHistory, createRouter } from 'vue-router'
import type { Role } from '../../../shared/types/roles.ts'
import AppNavigation from '../../../src/components/AppNavigation.vue'
import { routes } from '../../../src/router/routes.ts'

async function labelsFor(role: Role): Promise<string[]> {
  const router = createRouter({ history: createMemoryHistory(), routes })
  await router.push('/sign-in')
  const wrapper = mount(AppNavigation, {
    props: { role },
    global: { plugins: [Quasar, router] },
  })
  return wrapper.findAll('.q-item').map((item) => item.text().trim())
}

describe('AppNavigation', () => {
  it('shows an applicant their applications, emergency works and nothing of other roles', async () => {
    expect(await labelsFor('applicant')).toEqual([
      'Home',
      'My applications',
      'New application',
      'Emergency works',
    ])
  })

  it('shows a network engineer reviews, network, condition library and permit changes', async () => {
    expect(await labelsFor('asset_engineer')).toEqual([
      'Home',
      'Reviews',
      'Network',
      'Condition library',
      'Permit changes',
    ])
  })

  it('shows a permit officer applications, the works map, permit changes, works on site and the fee schedule', async () => {
    expect(await labelsFor('permit_officer')).toEqual([
      'Home',
      'Applications',
      'Works map',
      'Permit changes',
      'Works on site',
      'Fee schedule',
    ])
  })

  it('shows an administrator users, outgoing mail and the audit log', async () => {
    expect(await labelsFor('admin')).toEqual([
      'Home',
      'Users and organisations',
      'Outgoing mail',
      'Audit log',
    ])
  })
})
