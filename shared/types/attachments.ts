/** What an attached document is. */
export const ATTACHMENT_KINDS = [
  'method_statement',
  'lift_plan',
  'drawing',
  'photo',
  'other',
] as const
export type AttachmentKind = (typeof ATTACHMENT_KINDS)[number]

export const ATTACHMENT_KIND_LABELS: Record<AttachmentKind, string> = {
  method_statement: 'Method statement',
  lift_plan: 'Lift plan',
  drawing: 'Drawing',
  photo: 'Photo',
  other: 'Other document',
}

/** File types accepted, told from the content (PDF and common image formats). */
export const ATTACHMENT_TYPES = [
  'application/pdf',
  'image/png',
  'image/jpeg',
  'image/webp',
] as const

export interface AttachmentDto {
  id: number
  applicationId: number
  kind: AttachmentKind
  filename: string
  contentType: string
  size_bytes: number
  sha256: string
  uploadedBy: { id: number; name: string }
  createdAt: string
}
