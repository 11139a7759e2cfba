import { PASSWORD_MIN_LENGTH } from '../../shared/schemas/auth.ts'

// No look-alike characters (0/O, 1/l/I), so a password read out over the phone survives.
const ALPHABET = 'abcdefghijkmnpqrstuvwxyzABCDEFGHJKLMNPQRSTUVWXYZ23456789'

/** A random first password in groups of four, e.g. "h7Kq-3mWx-pT9c-Ve4n" (19 characters). */
export function suggestPassword(groups = 4): string {
  const length = Math.max(groups * 4, PASSWORD_MIN_LENGTH)
  const bytes = new Uint32Array(length)
  crypto.getRandomValues(bytes)
  const chars = Array.from(bytes, (value) => ALPHABET[value % ALPHABET.length] ?? 'x')
  const parts: string[] = []
  for (let i = 0; i < chars.length; i += 4) parts.push(chars.slice(i, i + 4).join(''))
  return parts.join('-')
}
