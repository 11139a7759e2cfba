import { createHash, randomInt } from 'node:crypto'
import { mkdir, writeFile } from 'node:fs/promises'
import { join, resolve } from 'node:path'
import { format } from 'date-fns'
import type { Sequelize, Transaction } from 'sequelize'
import {
  VERIFICATION_ALPHABET,
  VERIFICATION_CODE_LENGTH,
  formatVerificationCode,
} from '../../shared/schemas/verification.ts'
import type { PermitDto, PermitStatus } from '../../shared/types/permits.ts'
import { config } from '../config.ts'
import { enqueueMail } from '../mail/outbox.ts'
import { permitIssuedMail } from '../mail/templates/permit-issued.ts'
import { Permit } from '../models/index.ts'
import type { Application, User } from '../models/index.ts'
import { buildSignedPermitPdf } from '../pdf/permit-pdf.ts'
import { loadOrCreateSigningKey } from '../pdf/signing-key.ts'
import type { SigningKey } from '../pdf/signing-key.ts'
import { userEmail } from './mail-recipients.ts'
import { permitDocumentData, verificationUrl } from './permit-document-data.ts'
import { parseJson } from './review-dto.ts'
import { isoToday } from './review-clock.ts'

let key: { dir: string; promise: Promise<SigningKey> } | undefined

/** The permit-signing key of this deployment (created in KEY_DIR on first use). */
export function permitSigningKey(): Promise<SigningKey> {
  const dir = config().keyDir
  if (!key || key.dir !== dir) key = { dir, promise: loadOrCreateSigningKey(dir) }
  return key.promise
}

/** Our permit number: TWP-<year of grant>-<application id, five digits>. Issues share it. */
export const permitNumber = (applicationId: number, grantedAt: Date) =>
  `TWP-${format(grantedAt, 'yyyy')}-${String(applicationId).padStart(5, '0')}`

/** A fresh random verification code not yet used by any permit issue. */
export async function newVerificationCode(transaction?: Transaction): Promise<string> {
  for (;;) {
    let code = ''
    for (let i = 0; i < VERIFICATION_CODE_LENGTH; i++)
      code += VERIFICATION_ALPHABET[randomInt(VERIFICATION_ALPHABET.length)]
    if (!(await Permit.count({ where: { verificationCode: code }, transaction }))) return code
  }
}

/** The status as of `today`: a valid issue past its last day reads as expired. */
export function effectivePermitStatus(p: Permit, today = isoToday()): PermitStatus {
  if (p.status === 'valid' && p.validTo < today) return 'expired'
  return p.status
}

export function toPermitDto(p: Permit, application: Application, issuedBy: User | null): PermitDto {
  return {
    id: p.id,
    number: p.number,
    issue: p.issue,
    applicationId: p.applicationId,
    applicationReference: application.reference ?? `#${application.id}`,
    status: effectivePermitStatus(p),
    changeKind: p.changeKind,
    changeReason: p.changeReason,
    validFrom: p.validFrom,
    validTo: p.validTo,
    conditions: parseJson(p.conditions),
    verificationCode: formatVerificationCode(p.verificationCode),
    verificationUrl: verificationUrl(p.verificationCode),
    pdfSha256: p.pdfSha256,
    documentUrl: `/api/permits/${p.id}/document`,
    issuedBy: { id: p.issuedByUserId, name: issuedBy?.name ?? '' },
    issuedAt: p.issuedAt.toISOString(),
    revokedAt: p.revokedAt ? p.revokedAt.toISOString() : null,
    revokedReason: p.revokedReason,
  }
}

/**
 * Produce the signed PDF of a permit issue inside the caller's transaction: lay it out, sign
 * it, store it under PERMIT_DIR with its SHA-256 on the row, and put the mail with the PDF
 * attached to the applicant in the outbox. If the transaction rolls back, the file stays
 * behind unreferenced, which is harmless.
 */
export async function issuePermitDocument(
  sequelize: Sequelize,
  permit: Permit,
  application: Application,
  transaction: Transaction,
): Promise<void> {
  const cfg = config()
  const signingKey = await permitSigningKey()
  const data = await permitDocumentData(
    sequelize,
    permit,
    signingKey.certificateSha256,
    transaction,
  )
  const pdf = await buildSignedPermitPdf(data, signingKey)
  const sha256 = createHash('sha256').update(pdf).digest('hex')
  const dir = resolve(cfg.permitDir)
  await mkdir(dir, { recursive: true })
  const path = join(dir, `${permit.number}-${permit.issue}-${permit.verificationCode}.pdf`)
  await writeFile(path, pdf, { mode: 0o640 })
  await permit.update({ pdfPath: path, pdfSha256: sha256 }, { transaction })
  const mail = permitIssuedMail({
    publicUrl: cfg.publicUrl,
    applicationId: application.id,
    reference: application.reference ?? `#${application.id}`,
    permitNumber: permit.number,
    issue: permit.issue,
    changeKind: permit.changeKind,
    validFrom: permit.validFrom,
    validTo: permit.validTo,
    conditionCount: parseJson<unknown[]>(permit.conditions).length,
    verificationCode: formatVerificationCode(permit.verificationCode),
    reason: permit.changeReason,
  })
  for (const to of await userEmail(application.createdByUserId, transaction)) {
    await enqueueMail(
      {
        to: [to],
        ...mail,
        attachments: [
          {
            filename: `${permit.number}-issue-${permit.issue}.pdf`,
            path,
            contentType: 'application/pdf',
          },
        ],
        related: { type: 'permit', id: permit.id },
      },
      transaction,
    )
  }
}
