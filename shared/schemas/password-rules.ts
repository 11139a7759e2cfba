/**
 * Password rules (length over composition, after NIST SP 800-63B section 5.1.1.2): at least
 * PASSWORD_MIN_LENGTH characters, at most 200, not the account's own e-mail address (or its
 * local part), and not one of the passwords every guessing list starts with. The list is short
 * on purpose: length does most of the work; it catches the obvious choices that pass the
 * length rule.
 */
export const PASSWORD_MIN_LENGTH = 12
export const PASSWORD_MAX_LENGTH = 200

/** Lower-case; compared after trimming and lower-casing the candidate. */
const COMMON_PASSWORDS: ReadonlySet<string> = new Set([
  '123456789012',
  '1234567890123',
  '12345678901234',
  '123456789000',
  '000000000000',
  '111111111111',
  '123123123123',
  'qwertyuiopas',
  'qwerty123456',
  '1q2w3e4r5t6y',
  'qwertyuiop123',
  'asdfghjklzxc',
  'passwordpassword',
  'password1234',
  'password12345',
  'password123456',
  'passwort1234',
  'passw0rd1234',
  'iloveyou1234',
  'letmein12345',
  'welcome12345',
  'welcome123456',
  'willkommen123',
  'changeme1234',
  'administrator',
  'admin1234567',
  'abcdefghijkl',
  'abcd12345678',
  'trustno11234',
  'sunshine1234',
  'football1234',
  'monkey123456',
  'dragon123456',
  'princess1234',
  'baseball1234',
  'superman1234',
  'starwars1234',
  'trenchward123',
  'trenchward1234',
])

/** True when the password is on the short list of guessable choices (or one character repeated). */
export function isCommonPassword(password: string): boolean {
  const p = password.trim().toLowerCase()
  return COMMON_PASSWORDS.has(p) || /^(.)\1*$/.test(p)
}

/** The problem with `password` for the account `email`, or null when it is acceptable. */
export function passwordProblem(password: string, email?: string | null): string | null {
  if (password.length < PASSWORD_MIN_LENGTH) return `Use at least ${PASSWORD_MIN_LENGTH} characters`
  if (password.length > PASSWORD_MAX_LENGTH) return `Use at most ${PASSWORD_MAX_LENGTH} characters`
  if (isCommonPassword(password)) return 'This password is too common; choose a less obvious one'
  if (email) {
    const p = password.trim().toLowerCase()
    const e = email.trim().toLowerCase()
    const local = e.split('@')[0] ?? ''
    if (p === e || (local.length >= 4 && p === local))
      return 'Do not use your e-mail address as the password'
  }
  return null
}
