import { normaliseVerificationCode } from '../../shared/schemas/verification.ts'
import type { DocumentCheckDto, VerificationDto } from '../../shared/types/verification.ts'
import { http } from './http.ts'
import { uploadMultipart } from './upload.ts'

/** The public check of a permit code (no sign-in). */
export function verifyCode(code: string): Promise<VerificationDto> {
  return http.get<VerificationDto>(`/verify/${encodeURIComponent(normaliseVerificationCode(code))}`)
}

/** Uploads a PDF and asks whether it is the unaltered document issued under the code. */
export function checkPermitDocument(code: string, file: File): Promise<DocumentCheckDto> {
  const path = `/verify/${encodeURIComponent(normaliseVerificationCode(code))}/document`
  return uploadMultipart<DocumentCheckDto>(path, file, {}, () => undefined).promise
}
