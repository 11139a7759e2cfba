import type { SignInInput } from '../../shared/schemas/auth.ts'
import type { UserDto } from '../../shared/types/user.ts'
import { isApiError } from './api-error.ts'
import { http } from './http.ts'

/** Signs in with e-mail and password; the server sets the session cookie. */
export async function signIn(input: SignInInput): Promise<UserDto> {
  const { user } = await http.post<{ user: UserDto }>('/auth/sign-in', input)
  return user
}

export async function signOut(): Promise<void> {
  await http.post<void>('/auth/sign-out')
}

/** The signed-in user, or null when there is no session. */
export async function fetchMe(): Promise<UserDto | null> {
  try {
    const { user } = await http.get<{ user: UserDto }>('/auth/me')
    return user
  } catch (err) {
    if (isApiError(err) && err.status === 401) return null
    throw err
  }
}
