import { rm } from 'node:fs/promises'
import type { IncomingMessage } from 'node:http'
import { basename, resolve } from 'node:path'
import { format } from 'date-fns'
import { Op, QueryTypes } from 'sequelize'
import type { Sequelize, Transaction } from 'sequelize'
import type { PlannedStartInput, SiteEventInput } from '../../shared/schemas/site-works.ts'
import { sitePhotoKindSchema } from '../../shared/schemas/site-works.ts'
import type { PermitCondition } from '../../shared/types/permits.ts'
import type {
  RequiredPhotoKind,
  SiteEventDto,
  SitePhotoDto,
  SiteRequirements,
  SiteState,
  SiteWorksDto,
} from '../../shared/types/site-works.ts'
import { SITE_PHOTO_LABELS } from '../../shared/types/site-works.ts'
import { config } from '../config.ts'
import { domainRule, forbidden, notFound, validationFailed } from '../errors.ts'
import { enqueueMail } from '../mail/outbox.ts'
import { worksFinishedMail } from '../mail/templates/works-finished.ts'
import { worksStartedMail } from '../mail/templates/works-started.ts'
import { Application, Organisation, Permit, SiteEvent, SitePhoto, User } from '../models/index.ts'
import { applicationForParty } from './application-parties.ts'
import { recordAudit } from './audit.ts'
import { organisationEmails } from './mail-recipients.ts'
import { isoToday } from './review-clock.ts'
import { parseJson } from './review-dto.ts'
import { siteRequirements } from './site-requirements.ts'
import { sniffContentType } from './uploads/content-type.ts'
import { receiveFile } from './uploads/receive-file.ts'
import { storedFile } from './uploads/stored-file.ts'
import type { StoredFile } from './uploads/stored-file.ts'

/** How a time reads in site mails and messages (server time zone). */
export const siteTime = (d: Date) => format(d, 'EEE d MMM yyyy, HH:mm')

/** A start or finish may be recorded up to this long ahead of the server's clock (phone clocks drift). */
const CLOCK_SLACK_MS = 5 * 60_000

const photoDir = () => resolve(config().uploadDir, 'site-photos')

/** The current issue of an application's permit: the latest valid one. */
export async function currentPermit(
  applicationId: number,
  transaction?: Transaction,
): Promise<Permit | null> {
  return Permit.findOne({
    where: { applicationId, status: 'valid' },
    order: [['issue', 'DESC']],
    transaction,
  })
}

/** Site state from an application's events: started and not finished is on site. */
export function siteStateOf(events: readonly Pick<SiteEvent, 'kind'>[]): SiteState {
  if (events.some((e) => e.kind === 'finished')) return 'finished'
  if (events.some((e) => e.kind === 'started')) return 'on_site'
  return 'not_started'
}

/** Site state of many applications at once (not_started when nothing is recorded). */
export async function siteStates(
  applicationIds: readonly number[],
  transaction?: Transaction,
): Promise<Map<number, SiteState>> {
  const out = new Map<number, SiteState>()
  if (!applicationIds.length) return out
  const events = await SiteEvent.findAll({
    where: {
      applicationId: { [Op.in]: [...new Set(applicationIds)] },
      kind: { [Op.in]: ['started', 'finished'] },
    },
    attributes: ['applicationId', 'kind'],
    transaction,
  })
  const by = new Map<number, SiteEvent[]>()
  for (const e of events) by.set(e.applicationId, [...(by.get(e.applicationId) ?? []), e])
  for (const id of applicationIds) out.set(id, siteStateOf(by.get(id) ?? []))
  return out
}

function toEventDto(e: SiteEvent, names: Map<number, string>): SiteEventDto {
  return {
    id: e.id,
    kind: e.kind,
    at: e.at.toISOString(),
    note: e.note,
    recordedBy: { id: e.recordedByUserId, name: names.get(e.recordedByUserId) ?? '' },
    recordedAt: e.createdAt.toISOString(),
  }
}

function toPhotoDto(p: SitePhoto): SitePhotoDto {
  return {
    id: p.id,
    kind: p.kind,
    caption: p.caption,
    filename: p.originalFilename,
    contentType: p.contentType,
    size_bytes: Number(p.sizeBytes),
    sha256: p.sha256,
    url: `/api/site-works/${p.applicationId}/photos/${p.id}/file`,
    uploadedAt: p.createdAt.toISOString(),
  }
}

const missingPhotos = (req: SiteRequirements, photos: readonly SitePhoto[]): RequiredPhotoKind[] =>
  req.photoKinds.filter((k) => !photos.some((p) => p.kind === k))

async function build(
  a: Application,
  permit: Permit,
  transaction?: Transaction,
): Promise<SiteWorksDto> {
  const events = await SiteEvent.findAll({
    where: { applicationId: a.id },
    order: [['id', 'ASC']],
    transaction,
  })
  const photos = await SitePhoto.findAll({
    where: { applicationId: a.id },
    order: [['id', 'ASC']],
    transaction,
  })
  const users = await User.findAll({
    where: { id: { [Op.in]: [0, ...new Set(events.map((e) => e.recordedByUserId))] } },
    attributes: ['id', 'name'],
    transaction,
  })
  const names = new Map(users.map((u) => [u.id, u.name]))
  const requirements = await siteRequirements(
    parseJson<PermitCondition[]>(permit.conditions),
    transaction,
  )
  const last = (kind: SiteEvent['kind']) =>
    [...events]
      .reverse()
      .find((e) => e.kind === kind)
      ?.at.toISOString() ?? null
  return {
    applicationId: a.id,
    reference: a.reference ?? `#${a.id}`,
    permitId: permit.id,
    permitNumber: permit.number,
    validFrom: permit.validFrom,
    validTo: permit.validTo,
    state: siteStateOf(events),
    plannedStartAt: last('planned_start'),
    startedAt: last('started'),
    finishedAt: last('finished'),
    events: events.map((e) => toEventDto(e, names)),
    photos: photos.map(toPhotoDto),
    requirements,
    missingPhotoKinds: missingPhotos(requirements, photos),
  }
}

/** The granted application and its current permit, for any party of it. */
async function loadForParty(user: User, applicationId: number) {
  const a = await applicationForParty(user, applicationId)
  if (!a) throw notFound('application', applicationId)
  const permit = await currentPermit(a.id)
  if (!permit) throw notFound('permit of application', applicationId)
  return { a, permit }
}

/** The applicant's own granted application, locked, with its current permit. */
async function lockForApplicant(user: User, applicationId: number, transaction: Transaction) {
  if (user.role !== 'applicant') throw forbidden()
  const a = await Application.findByPk(applicationId, {
    transaction,
    lock: transaction.LOCK.UPDATE,
  })
  if (!a || a.applicantOrganisationId !== user.organisationId) {
    throw notFound('application', applicationId)
  }
  if (a.status !== 'granted') {
    throw domainRule(`Works can be recorded only on a granted permit; this one is ${a.status}`)
  }
  const permit = await currentPermit(a.id, transaction)
  if (!permit) throw domainRule('This application has no valid permit')
  return { a, permit }
}

/** Where the works on a granted permit stand, for its parties. */
export async function getSiteWorks(user: User, applicationId: number): Promise<SiteWorksDto> {
  const { a, permit } = await loadForParty(user, applicationId)
  return build(a, permit)
}

function withinValidity(at: Date, permit: Permit, field: string): void {
  const d = isoToday(at)
  if (d < permit.validFrom || d > permit.validTo) {
    throw domainRule(`The permit is valid from ${permit.validFrom} to ${permit.validTo}`, [
      { field, message: `Must be between ${permit.validFrom} and ${permit.validTo}` },
    ])
  }
}

/**
 * Record when the works are planned to start. Every owner who attends must get the notice
 * its conditions ask for, so a planned start closer than the longest notice is refused, naming
 * the earliest time that would do. The scheduler mails each attending owner its notice hours
 * ahead (see attendance-notices.ts). A later planned start replaces an earlier one.
 */
export async function recordPlannedStart(
  sequelize: Sequelize,
  user: User,
  applicationId: number,
  input: PlannedStartInput,
  now = new Date(),
): Promise<SiteWorksDto> {
  const plannedAt = new Date(input.plannedStartAt)
  await sequelize.transaction(async (transaction) => {
    const { a, permit } = await lockForApplicant(user, applicationId, transaction)
    const events = await SiteEvent.findAll({ where: { applicationId: a.id }, transaction })
    if (siteStateOf(events) !== 'not_started') {
      throw domainRule('The works have already started; a planned start is no longer needed')
    }
    if (plannedAt.getTime() <= now.getTime()) {
      throw validationFailed([{ field: 'plannedStartAt', message: 'Must be in the future' }])
    }
    withinValidity(plannedAt, permit, 'plannedStartAt')
    const req = await siteRequirements(parseJson<PermitCondition[]>(permit.conditions), transaction)
    const earliest = new Date(now.getTime() + req.notice_h * 3_600_000)
    if (plannedAt < earliest) {
      const who = req.attendance
        .filter((o) => now.getTime() + o.notice_h * 3_600_000 > plannedAt.getTime())
        .map((o) => `${o.owner.name} (${o.notice_h} h)`)
      throw domainRule(
        `Too short notice for the owners who attend: ${who.join(', ')}. The earliest start is ${siteTime(earliest)}.`,
        [{ field: 'plannedStartAt', message: `Not before ${earliest.toISOString()}` }],
      )
    }
    const e = await SiteEvent.create(
      {
        applicationId: a.id,
        permitId: permit.id,
        kind: 'planned_start',
        at: plannedAt,
        note: input.note || null,
        recordedByUserId: user.id,
      },
      { transaction },
    )
    await recordAudit(
      {
        actorUserId: user.id,
        action: 'site-start-planned',
        entityType: 'application',
        entityId: a.id,
        details: {
          siteEventId: e.id,
          plannedStartAt: plannedAt.toISOString(),
          permitId: permit.id,
        },
      },
      transaction,
    )
  })
  return getSiteWorks(user, applicationId)
}

/** Mail a site notice to every engineer of an owner. */
async function mailOwner(
  ownerId: number,
  mail: { subject: string; text: string },
  applicationId: number,
  transaction: Transaction,
): Promise<void> {
  for (const to of await organisationEmails(ownerId, 'asset_engineer', transaction)) {
    await enqueueMail(
      { to: [to], ...mail, related: { type: 'application', id: applicationId } },
      transaction,
    )
  }
}

/**
 * Record that the works have started. Each owner who attends gets the start notice at once;
 * the mail says so plainly when no planned start reached that owner its notice hours ahead.
 */
export async function recordStart(
  sequelize: Sequelize,
  user: User,
  applicationId: number,
  input: SiteEventInput,
  now = new Date(),
): Promise<SiteWorksDto> {
  const at = input.at ? new Date(input.at) : now
  await sequelize.transaction(async (transaction) => {
    const { a, permit } = await lockForApplicant(user, applicationId, transaction)
    const events = await SiteEvent.findAll({ where: { applicationId: a.id }, transaction })
    if (siteStateOf(events) !== 'not_started')
      throw domainRule('The works are already recorded as started')
    if (at.getTime() > now.getTime() + CLOCK_SLACK_MS) {
      throw validationFailed([{ field: 'at', message: 'A start cannot be in the future' }])
    }
    withinValidity(at, permit, 'at')
    const e = await SiteEvent.create(
      {
        applicationId: a.id,
        permitId: permit.id,
        kind: 'started',
        at,
        note: input.note || null,
        recordedByUserId: user.id,
      },
      { transaction },
    )
    const req = await siteRequirements(parseJson<PermitCondition[]>(permit.conditions), transaction)
    const planned = events.filter((x) => x.kind === 'planned_start').map((x) => x.id)
    const noticed = planned.length
      ? await sequelize.query<{ owner: number; sentAt: Date; at: Date }>(
          `SELECT n.owner_organisation_id AS owner, n.sent_at AS sentAt, e.at AS at
             FROM attendance_notices n JOIN site_events e ON e.id = n.site_event_id
            WHERE n.site_event_id IN (?)`,
          { replacements: [planned], type: QueryTypes.SELECT, transaction },
        )
      : []
    for (const o of req.attendance) {
      // In time: a planned-start notice went out at least notice_h before the actual start.
      const inTime = noticed.some(
        (n) =>
          Number(n.owner) === o.owner.id &&
          at.getTime() - new Date(n.sentAt).getTime() >= o.notice_h * 3_600_000,
      )
      await sequelize.query(
        `INSERT IGNORE INTO attendance_notices
           (site_event_id, owner_organisation_id, notice_h, sent_at, created_at)
         VALUES (?, ?, ?, ?, ?)`,
        {
          replacements: [e.id, o.owner.id, o.notice_h, now, now],
          type: QueryTypes.INSERT,
          transaction,
        },
      )
      await mailOwner(
        o.owner.id,
        worksStartedMail({
          ownerName: o.owner.name,
          reference: a.reference ?? `#${a.id}`,
          permitNumber: permit.number,
          siteAddress: a.siteAddress,
          startedAt: siteTime(at),
          contactName: a.contactName,
          contactPhone: a.contactPhone,
          note: input.note || null,
          shortNotice: !inTime,
          notice_h: o.notice_h,
        }),
        a.id,
        transaction,
      )
    }
    await recordAudit(
      {
        actorUserId: user.id,
        action: 'site-works-started',
        entityType: 'application',
        entityId: a.id,
        details: {
          siteEventId: e.id,
          at: at.toISOString(),
          permitId: permit.id,
          ownersNotified: req.attendance.map((o) => o.owner.id),
        },
      },
      transaction,
    )
  })
  return getSiteWorks(user, applicationId)
}

/**
 * Record that the works are finished. Every photo kind a condition demands must be on record
 * first. Owners who attend or who asked for photos are mailed.
 */
export async function recordFinish(
  sequelize: Sequelize,
  user: User,
  applicationId: number,
  input: SiteEventInput,
  now = new Date(),
): Promise<SiteWorksDto> {
  const at = input.at ? new Date(input.at) : now
  await sequelize.transaction(async (transaction) => {
    const { a, permit } = await lockForApplicant(user, applicationId, transaction)
    const events = await SiteEvent.findAll({ where: { applicationId: a.id }, transaction })
    const state = siteStateOf(events)
    if (state === 'not_started') throw domainRule('Record the start of the works first')
    if (state === 'finished') throw domainRule('The works are already recorded as finished')
    const started = events.find((x) => x.kind === 'started')!
    if (at.getTime() > now.getTime() + CLOCK_SLACK_MS) {
      throw validationFailed([{ field: 'at', message: 'A finish cannot be in the future' }])
    }
    if (at < started.at) {
      throw validationFailed([{ field: 'at', message: 'Must not be before the start' }])
    }
    const conditions = parseJson<PermitCondition[]>(permit.conditions)
    const req = await siteRequirements(conditions, transaction)
    const photos = await SitePhoto.findAll({ where: { applicationId: a.id }, transaction })
    const missing = missingPhotos(req, photos)
    if (missing.length) {
      throw domainRule(
        `The conditions ask for photos first: ${missing.map((k) => SITE_PHOTO_LABELS[k].toLowerCase()).join(', ')}`,
        missing.map((k) => ({
          field: `photos.${k}`,
          message: `Upload at least one ${SITE_PHOTO_LABELS[k].toLowerCase()} photo`,
        })),
      )
    }
    const e = await SiteEvent.create(
      {
        applicationId: a.id,
        permitId: permit.id,
        kind: 'finished',
        at,
        note: input.note || null,
        recordedByUserId: user.id,
      },
      { transaction },
    )
    // Owners who attend, and owners whose library conditions ask for photos.
    const owners = new Set(req.attendance.map((o) => o.owner.id))
    if (req.photoKinds.length) {
      for (const c of conditions)
        if (c.ownerOrganisationId != null) owners.add(c.ownerOrganisationId)
    }
    const orgs = owners.size
      ? await Organisation.findAll({
          where: { id: { [Op.in]: [...owners] } },
          attributes: ['id', 'name'],
          transaction,
        })
      : []
    const photoCounts = (['reinstatement', 'trial_holes', 'other'] as const).map((k) => ({
      label: SITE_PHOTO_LABELS[k].toLowerCase(),
      count: photos.filter((p) => p.kind === k).length,
    }))
    for (const o of orgs) {
      await mailOwner(
        o.id,
        worksFinishedMail({
          ownerName: o.name,
          reference: a.reference ?? `#${a.id}`,
          permitNumber: permit.number,
          siteAddress: a.siteAddress,
          finishedAt: siteTime(at),
          photoCounts,
          note: input.note || null,
        }),
        a.id,
        transaction,
      )
    }
    await recordAudit(
      {
        actorUserId: user.id,
        action: 'site-works-finished',
        entityType: 'application',
        entityId: a.id,
        details: {
          siteEventId: e.id,
          at: at.toISOString(),
          permitId: permit.id,
          photos: photos.length,
        },
      },
      transaction,
    )
  })
  return getSiteWorks(user, applicationId)
}

/**
 * Store one photo from site (multipart field `file`, field `kind`, optional `caption`). Only
 * images are accepted, told from their content (PNG, JPEG, WebP); at most ATTACHMENT_MAX_MB.
 */
export async function addSitePhoto(
  req: IncomingMessage,
  user: User,
  applicationId: number,
): Promise<SitePhotoDto> {
  if (user.role !== 'applicant') throw forbidden()
  const a = await Application.findByPk(applicationId)
  if (!a || a.applicantOrganisationId !== user.organisationId) {
    throw notFound('application', applicationId)
  }
  if (a.status !== 'granted') throw domainRule('Photos can be added to granted works only')
  const file = await receiveFile(req, photoDir(), config().ATTACHMENT_MAX_MB * 1024 * 1024)
  try {
    const kind = sitePhotoKindSchema.safeParse(file.fields.kind)
    if (!kind.success) {
      throw validationFailed([{ field: 'kind', message: 'Choose what the photo shows' }])
    }
    const contentType = sniffContentType(file.head)
    if (!contentType || !contentType.startsWith('image/')) {
      throw validationFailed([
        { field: 'file', message: 'Only photos (JPEG, PNG or WebP) can be added' },
      ])
    }
    const caption = (file.fields.caption ?? '').trim().slice(0, 300) || null
    const row = await SitePhoto.create({
      applicationId: a.id,
      kind: kind.data,
      caption,
      originalFilename: basename(file.originalFilename).replace(/[\r\n"\\]/g, '_'),
      contentType,
      sizeBytes: file.sizeBytes,
      sha256: file.sha256,
      storageName: basename(file.path),
      uploadedByUserId: user.id,
    })
    await recordAudit({
      actorUserId: user.id,
      action: 'site-photo-added',
      entityType: 'application',
      entityId: a.id,
      details: { photoId: row.id, kind: row.kind, sha256: row.sha256 },
    })
    return toPhotoDto(row)
  } catch (err) {
    await rm(file.path, { force: true })
    throw err
  }
}

/** The stored file of one site photo, for the parties; only ids reach the file system. */
export async function sitePhotoFile(
  user: User,
  applicationId: number,
  photoId: number,
): Promise<StoredFile> {
  await loadForParty(user, applicationId)
  const row = await SitePhoto.findOne({ where: { id: photoId, applicationId } })
  if (!row) throw notFound('photo', photoId)
  return storedFile(photoDir(), row, 'photo', photoId)
}
