import { createRouter, createWebHistory } from 'vue-router'
import { Notify } from 'quasar'
import { onUnauthenticated } from '../api/http.ts'
import { config } from '../config.ts'
import { useSessionStore } from '../stores/session.ts'
import { notifyError } from '../utils/notify-error.ts'
import { roleMayOpen } from './navigation.ts'
import { routes } from './routes.ts'
import { safeNext } from './safe-next.ts'

export const router = createRouter({
  history: createWebHistory(),
  routes,
  scrollBehavior: () => ({ top: 0 }),
})

router.beforeEach(async (to) => {
  const session = useSessionStore()
  try {
    await session.loadSession()
  } catch (err) {
    // The server could not be asked; treat as signed out but say why.
    if (!to.meta.public) notifyError(err)
    session.forget()
  }
  const user = session.user

  if (to.name === 'sign-in' && user) return safeNext(to.query.next) ?? { name: 'home' }
  if (to.meta.public) return true
  if (!user) {
    return { name: 'sign-in', query: to.fullPath === '/' ? {} : { next: to.fullPath } }
  }
  if (!roleMayOpen(user.role, to.meta.roles)) {
    Notify.create({
      type: 'warning',
      message: `${to.meta.title ?? 'That page'} is not open to your role, so you are back on Home.`,
    })
    return { name: 'home' }
  }
  return true
})

router.afterEach((to) => {
  document.title = to.meta.title ? `${to.meta.title} · ${config.appName}` : config.appName
})

// The session ended while the user was working (expired, signed out elsewhere).
onUnauthenticated(() => {
  const session = useSessionStore()
  if (!session.user) return
  session.forget()
  const current = router.currentRoute.value
  Notify.create({ type: 'info', message: 'Your session has ended. Sign in again to carry on.' })
  void router.push({ name: 'sign-in', query: { next: current.fullPath } })
})
