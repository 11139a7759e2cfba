import { rm } from 'node:fs/promises'
import type { IncomingMessage } from 'node:http'
import { basename, join, resolve } from 'node:path'
import { z } from 'zod'
import type { AttachmentDto } from '../../shared/types/attachments.ts'
import { ATTACHMENT_KINDS } from '../../shared/types/attachments.ts'
import type { ApplicationStatus } from '../../shared/types/application.ts'
import { config } from '../config.ts'
import { domainRule, forbidden, notFound, validationFailed } from '../errors.ts'
import { Op } from 'sequelize'
import { Application, ApplicationAttachment, Assessment, User } from '../models/index.ts'
import { canRead } from './applications.ts'
import { recordAudit } from './audit.ts'
import { sniffContentType } from './uploads/content-type.ts'
import { receiveFile } from './uploads/receive-file.ts'
import { storedFile } from './uploads/stored-file.ts'
import type { StoredFile } from './uploads/stored-file.ts'

/** Statuses in which the applicant may still add documents (drafts, and while it is being decided). */
const OPEN_FOR_DOCUMENTS: readonly ApplicationStatus[] = [
  'draft',
  'submitted',
  'with_owners',
  'ready_for_decision',
]

const kindField = z.enum(ATTACHMENT_KINDS, { message: 'Choose what the document is' })

const attachmentDir = () => resolve(config().uploadDir, 'attachments')

function toDto(a: ApplicationAttachment, uploader: { id: number; name: string }): AttachmentDto {
  return {
    id: a.id,
    applicationId: a.applicationId,
    kind: a.kind,
    filename: a.originalFilename,
    contentType: a.contentType,
    size_bytes: Number(a.sizeBytes),
    sha256: a.sha256,
    uploadedBy: uploader,
    createdAt: a.createdAt.toISOString(),
  }
}

/**
 * Who may see an application's documents: whoever may read the application, and the engineers
 * of every owner whose pipes its works reach (they review it).
 */
async function mayReadDocuments(user: User, a: Application): Promise<boolean> {
  if (canRead(user, a)) return true
  if (user.role !== 'asset_engineer' || a.status === 'draft') return false
  return (
    (await Assessment.count({
      where: { applicationId: a.id, ownerOrganisationId: user.organisationId },
    })) > 0
  )
}

async function loadReadable(user: User, applicationId: number): Promise<Application> {
  const a = await Application.findByPk(applicationId)
  if (!a || !(await mayReadDocuments(user, a))) throw notFound('application', applicationId)
  return a
}

/**
 * Store one uploaded document (multipart field `file`, field `kind`). Its type is told from its
 * content (PDF, PNG, JPEG, WebP); size at most ATTACHMENT_MAX_MB; stored with its SHA-256.
 */
export async function addAttachment(
  req: IncomingMessage,
  user: User,
  applicationId: number,
): Promise<AttachmentDto> {
  if (user.role !== 'applicant') throw forbidden()
  const a = await loadReadable(user, applicationId)
  if (a.applicantOrganisationId !== user.organisationId)
    throw notFound('application', applicationId)
  if (!OPEN_FOR_DOCUMENTS.includes(a.status)) {
    throw domainRule(`Documents cannot be added to an application that is ${a.status}`)
  }
  const file = await receiveFile(req, attachmentDir(), config().ATTACHMENT_MAX_MB * 1024 * 1024)
  try {
    const kind = kindField.safeParse(file.fields.kind)
    if (!kind.success)
      throw validationFailed([{ field: 'kind', message: 'Choose what the document is' }])
    const contentType = sniffContentType(file.head)
    if (!contentType) {
      throw validationFailed([
        { field: 'file', message: 'Only PDF, PNG, JPEG or WebP files can be attached' },
      ])
    }
    const row = await ApplicationAttachment.create({
      applicationId: a.id,
      kind: kind.data,
      originalFilename: basename(file.originalFilename).replace(/[\r\n"\\]/g, '_'),
      contentType,
      sizeBytes: file.sizeBytes,
      sha256: file.sha256,
      storageName: basename(file.path),
      uploadedByUserId: user.id,
    })
    await recordAudit({
      actorUserId: user.id,
      action: 'attachment-added',
      entityType: 'application',
      entityId: a.id,
      details: {
        attachmentId: row.id,
        kind: row.kind,
        sha256: row.sha256,
        size_bytes: row.sizeBytes,
      },
    })
    return toDto(row, { id: user.id, name: user.name })
  } catch (err) {
    await rm(file.path, { force: true })
    throw err
  }
}

export async function listAttachments(user: User, applicationId: number): Promise<AttachmentDto[]> {
  await loadReadable(user, applicationId)
  const rows = await ApplicationAttachment.findAll({
    where: { applicationId },
    order: [['id', 'ASC']],
  })
  const uploaders = new Map(
    (
      await User.findAll({
        where: { id: { [Op.in]: [...new Set(rows.map((r) => r.uploadedByUserId))] } },
        attributes: ['id', 'name'],
      })
    ).map((u) => [u.id, { id: u.id, name: u.name }]),
  )
  return rows.map((r) =>
    toDto(r, uploaders.get(r.uploadedByUserId) ?? { id: r.uploadedByUserId, name: 'unknown' }),
  )
}

/** The stored file of one attachment: only ids reach the file system, never a name from the request. */
export async function attachmentFile(
  user: User,
  applicationId: number,
  attachmentId: number,
): Promise<StoredFile> {
  await loadReadable(user, applicationId)
  const row = await ApplicationAttachment.findOne({ where: { id: attachmentId, applicationId } })
  if (!row) throw notFound('attachment', attachmentId)
  return storedFile(attachmentDir(), row, 'attachment', attachmentId)
}

/** Remove a document from a draft. */
export async function deleteAttachment(
  user: User,
  applicationId: number,
  attachmentId: number,
): Promise<void> {
  if (user.role !== 'applicant') throw forbidden()
  const a = await loadReadable(user, applicationId)
  if (a.applicantOrganisationId !== user.organisationId)
    throw notFound('application', applicationId)
  if (a.status !== 'draft') throw domainRule('Documents of a submitted application stay on record')
  const row = await ApplicationAttachment.findOne({ where: { id: attachmentId, applicationId } })
  if (!row) throw notFound('attachment', attachmentId)
  await row.destroy()
  await rm(join(attachmentDir(), row.storageName), { force: true })
  await recordAudit({
    actorUserId: user.id,
    action: 'attachment-removed',
    entityType: 'application',
    entityId: a.id,
    details: { attachmentId },
  })
}
