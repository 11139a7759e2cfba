import type { AttachmentDto, AttachmentKind } from '../../shared/types/attachments.ts'
import { config } from '../config.ts'
import { http } from './http.ts'
import { uploadMultipart } from './upload.ts'
import type { UploadHandle } from './upload.ts'

export function fetchAttachments(applicationId: number): Promise<AttachmentDto[]> {
  return http
    .get<{ items: AttachmentDto[] }>(`/applications/${applicationId}/attachments`)
    .then((r) => r.items)
}

export function uploadAttachment(
  applicationId: number,
  file: File,
  kind: AttachmentKind,
  onProgress: (fraction: number) => void,
): UploadHandle<AttachmentDto> {
  return uploadMultipart<AttachmentDto>(
    `/applications/${applicationId}/attachments`,
    file,
    { kind },
    onProgress,
  )
}

export function deleteAttachment(applicationId: number, attachmentId: number): Promise<void> {
  return http.delete<void>(`/applications/${applicationId}/attachments/${attachmentId}`)
}

/** Where the browser downloads an attachment (same-origin; the session cookie goes along). */
export function attachmentFileUrl(applicationId: number, attachmentId: number): string {
  return `${config.apiBase}/applications/${applicationId}/attachments/${attachmentId}/file`
}
