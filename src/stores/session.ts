import { defineStore } from 'pinia'
import { computed, ref } from 'vue'
import * as authApi from '../api/auth.ts'
import type { SignInInput } from '../../shared/schemas/auth.ts'
import type { Role } from '../../shared/types/roles.ts'
import type { UserDto } from '../../shared/types/user.ts'

/** Who is signed in. The route guard asks it once per page load; pages read it. */
export const useSessionStore = defineStore('session', () => {
  const user = ref<UserDto | null>(null)
  const checked = ref(false)
  let pending: Promise<UserDto | null> | null = null

  const isSignedIn = computed(() => user.value !== null)
  const role = computed<Role | null>(() => user.value?.role ?? null)

  /** Asks the server who is signed in, once; later calls reuse the answer. */
  function loadSession(): Promise<UserDto | null> {
    if (checked.value) return Promise.resolve(user.value)
    pending ??= authApi
      .fetchMe()
      .then((me) => {
        user.value = me
        checked.value = true
        return me
      })
      .finally(() => {
        pending = null
      })
    return pending
  }

  async function signIn(input: SignInInput): Promise<UserDto> {
    const me = await authApi.signIn(input)
    user.value = me
    checked.value = true
    return me
  }

  async function signOut(): Promise<void> {
    try {
      await authApi.signOut()
    } finally {
      forget()
    }
  }

  /** Drops the local copy, e.g. when the server says the session has ended. */
  function forget(): void {
    user.value = null
    checked.value = true
  }

  return { user, checked, isSignedIn, role, loadSession, signIn, signOut, forget }
})
