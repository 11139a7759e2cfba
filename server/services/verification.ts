import { createHash } from 'node:crypto'
import { readFile } from 'node:fs/promises'
import {
  VERIFICATION_ALPHABET,
  VERIFICATION_CODE_LENGTH,
} from '../../shared/schemas/verification.ts'
import type {
  DocumentCheckDto,
  VerificationDto,
  VerificationState,
} from '../../shared/types/verification.ts'
import { Application, Organisation, Permit } from '../models/index.ts'
import { effectivePermitStatus } from './permit-issue.ts'
import { parseJson } from './review-dto.ts'

const CODE = new RegExp(`^[${VERIFICATION_ALPHABET}]{${VERIFICATION_CODE_LENGTH}}$`)

const UNKNOWN: VerificationDto = {
  state: 'unknown',
  permitNumber: null,
  issue: null,
  validFrom: null,
  validTo: null,
  conditionCount: null,
  applicantOrganisation: null,
  site: null,
}

async function findByCode(code: string): Promise<Permit | null> {
  if (!CODE.test(code)) return null
  return Permit.findOne({ where: { verificationCode: code } })
}

/**
 * The public check of a verification code (already normalised): the state of that permit
 * issue as of today (valid, expired, revoked, superseded by a later issue, or unknown), its
 * number, validity, number of conditions, the applicant organisation and the site. Nothing else.
 */
export async function verifyCode(code: string): Promise<VerificationDto> {
  const p = await findByCode(code)
  if (!p) return UNKNOWN
  const a = await Application.findByPk(p.applicationId, {
    include: [{ model: Organisation, as: 'applicantOrganisation', attributes: ['name'] }],
  })
  return {
    state: effectivePermitStatus(p) as VerificationState,
    permitNumber: p.number,
    issue: p.issue,
    validFrom: p.validFrom,
    validTo: p.validTo,
    conditionCount: parseJson<unknown[]>(p.conditions).length,
    applicantOrganisation: a?.applicantOrganisation?.name ?? null,
    site: a?.siteAddress ?? a?.title ?? null,
  }
}

/** Whether an uploaded file is byte for byte the PDF issued under the code. */
export async function checkDocument(code: string, file: Buffer): Promise<DocumentCheckDto> {
  const uploadedSha256 = createHash('sha256').update(file).digest('hex')
  const p = await findByCode(code)
  if (!p || !p.pdfSha256) return { state: 'unknown', matches: false, uploadedSha256 }
  let matches = p.pdfSha256 === uploadedSha256
  // Belt and braces: the stored file must still hash to the recorded value.
  if (matches && p.pdfPath) {
    const stored = await readFile(p.pdfPath).catch(() => null)
    if (stored) matches = createHash('sha256').update(stored).digest('hex') === p.pdfSha256
  }
  return { state: effectivePermitStatus(p) as VerificationState, matches, uploadedSha256 }
}
