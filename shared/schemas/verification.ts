import { z } from 'zod'

/**
 * Verification codes: ten characters from an alphabet without look-alikes (no 0/O, 1/I/L, no U
 * or V pair), shown as XXXX-XXXX-XX. Input is accepted in any case, with or without dashes and
 * spaces.
 */
export const VERIFICATION_ALPHABET = '23456789ABCDEFGHJKMNPQRSTWXYZ'
export const VERIFICATION_CODE_LENGTH = 10

/** The stored form of a code as typed (upper case, separators removed). */
export const normaliseVerificationCode = (code: string) => code.toUpperCase().replace(/[\s-]/g, '')

/** The code grouped for reading. */
export const formatVerificationCode = (code: string) =>
  `${code.slice(0, 4)}-${code.slice(4, 8)}-${code.slice(8)}`

export const verificationCodeParamSchema = z.object({
  code: z.string().max(40, 'Codes are ten characters long').transform(normaliseVerificationCode),
})
