/** What the public check tells about a code; nothing more leaves the server. */
export const VERIFICATION_STATES = ['valid', 'expired', 'revoked', 'superseded', 'unknown'] as const
export type VerificationState = (typeof VERIFICATION_STATES)[number]

export interface VerificationDto {
  state: VerificationState
  permitNumber: string | null
  issue: number | null
  validFrom: string | null
  validTo: string | null
  conditionCount: number | null
  applicantOrganisation: string | null
  site: string | null
}

export interface DocumentCheckDto {
  state: VerificationState
  /** True when the uploaded file is byte for byte the document issued under this code. */
  matches: boolean
  uploadedSha256: string
}
