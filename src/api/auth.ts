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

/** "Forgot password": the server answers the same words whether or not the address is known. */
export async function requestPasswordReset(email: string): Promise<string> {
  const { message } = await http.post<{ message: string }>('/auth/password-reset/request', {
    email,
  })
  return message
}

/** Sets the new password with the token from the mailed link. */
export async function completePasswordReset(token: string, password: string): Promise<void> {
  await http.post<void>('/auth/password-reset/complete', { token, password })
}
