import { Op, QueryTypes } from 'sequelize'
import type { Sequelize, Transaction, WhereOptions } from 'sequelize'
import { format, parseISO, startOfDay } from 'date-fns'
import { crsTransform } from '../../shared/geo/crs.ts'
import type {
  ActivityInput,
  ApplicationDraftInput,
  ApplicationUpdateInput,
} from '../../shared/schemas/application.ts'
import { submitApplicationSchema } from '../../shared/schemas/application.ts'
import { fieldIssuesFromZod } from '../../shared/schemas/field-issues.ts'
import type {
  ApplicationDto,
  ApplicationListItem,
  ApplicationStatus,
} from '../../shared/types/application.ts'
import { config } from '../config.ts'
import { conflict, domainRule, forbidden, notFound, validationFailed } from '../errors.ts'
import { geoJsonToGridWkt } from '../geo/wkt.ts'
import { Activity, Application, Organisation, User } from '../models/index.ts'
import { assessApplicationFee, closeApplicationFees } from './fee-charges.ts'
import { recordAudit } from './audit.ts'
import { payRefunds } from './refunds.ts'
import { screenApplication } from './screening.ts'
import { rescreenCombined } from './combined-screening.ts'
import { screeningTransaction } from './segment-locks.ts'
import { openOwnerReviews } from './review-opening.ts'
import { applicantScreening } from './screening-view.ts'
import type { ApplicationScreeningDto } from '../../shared/types/screening.ts'

const include = [
  { model: Activity, as: 'activities' },
  { model: Organisation, as: 'applicantOrganisation', attributes: ['id', 'name'] },
  { model: User, as: 'createdBy', attributes: ['id', 'name'] },
]

/** Statuses an applicant may still withdraw from. */
const WITHDRAWABLE: readonly ApplicationStatus[] = [
  'draft',
  'submitted',
  'with_owners',
  'ready_for_decision',
]

function parseJson<T>(v: unknown): T {
  return (typeof v === 'string' ? JSON.parse(v) : v) as T
}

export function toApplicationDto(a: Application): ApplicationDto {
  const activities = [...(a.activities ?? [])].sort((p, q) => p.position - q.position)
  return {
    id: a.id,
    reference: a.reference ?? `draft-${a.id}`,
    status: a.status,
    version: a.version,
    title: a.title,
    siteAddress: a.siteAddress,
    contactName: a.contactName,
    contactPhone: a.contactPhone,
    startsOn: a.startsOn,
    endsOn: a.endsOn,
    description: a.description,
    applicantOrganisation: { id: a.applicantOrganisation!.id, name: a.applicantOrganisation!.name },
    createdBy: { id: a.createdBy!.id, name: a.createdBy!.name },
    activities: activities.map((x) => ({ ...parseJson<ActivityInput>(x.input), id: x.id })),
    submittedAt: a.submittedAt ? a.submittedAt.toISOString() : null,
    createdAt: a.createdAt.toISOString(),
    updatedAt: a.updatedAt.toISOString(),
  }
}

/** Who may read an application: its applicant organisation, the permit office once it is submitted, admins. */
export function canRead(user: User, a: Application): boolean {
  if (user.role === 'admin') return true
  if (user.role === 'applicant') return a.applicantOrganisationId === user.organisationId
  if (user.role === 'permit_officer') return a.status !== 'draft'
  return false
}

async function loadForUser(
  id: number,
  user: User,
  transaction?: Transaction,
): Promise<Application> {
  const a = await Application.findByPk(id, { include, transaction })
  // Not-found and not-yours answer alike, so ids of other organisations' work do not leak.
  if (!a || !canRead(user, a)) throw notFound('application', id)
  return a
}

/** Replace the stored activities of an application (positions in order), inside a transaction. */
export async function writeActivities(
  sequelize: Sequelize,
  applicationId: number,
  activities: ActivityInput[],
  transaction: Transaction,
): Promise<void> {
  const epsg = config().PROJECTED_EPSG
  const t = crsTransform(epsg)
  await sequelize.query('DELETE FROM activities WHERE application_id = ?', {
    replacements: [applicationId],
    type: QueryTypes.DELETE,
    transaction,
  })
  for (const [position, activity] of activities.entries()) {
    await sequelize.query(
      `INSERT INTO activities (application_id, position, kind, label, input, geom, created_at, updated_at)
       VALUES (?, ?, ?, ?, ?, ST_GeomFromText(?, ?), NOW(), NOW())`,
      {
        replacements: [
          applicationId,
          position,
          activity.kind,
          activity.label ?? null,
          JSON.stringify(activity),
          geoJsonToGridWkt(t, activity.geometry),
          epsg,
        ],
        type: QueryTypes.INSERT,
        transaction,
      },
    )
  }
}

/** A new draft for the user's organisation. */
export async function createDraft(
  sequelize: Sequelize,
  user: User,
  input: ApplicationDraftInput,
): Promise<ApplicationDto> {
  const id = await sequelize.transaction(async (transaction) => {
    const a = await Application.create(
      {
        reference: null,
        title: input.title,
        siteAddress: input.siteAddress ?? null,
        contactName: input.contactName ?? user.name,
        contactPhone: input.contactPhone ?? null,
        startsOn: input.startsOn ?? null,
        endsOn: input.endsOn ?? null,
        description: input.description ?? null,
        applicantOrganisationId: user.organisationId,
        createdByUserId: user.id,
        submittedAt: null,
      },
      { transaction },
    )
    await writeActivities(sequelize, a.id, input.activities, transaction)
    await recordAudit(
      {
        actorUserId: user.id,
        action: 'application-created',
        entityType: 'application',
        entityId: a.id,
      },
      transaction,
    )
    return a.id
  })
  return toApplicationDto(await loadForUser(id, user))
}

/** Save a draft (the whole form, activities included); only drafts can change this way. */
export async function updateDraft(
  sequelize: Sequelize,
  user: User,
  id: number,
  input: ApplicationUpdateInput,
): Promise<ApplicationDto> {
  if (user.role !== 'applicant') throw forbidden()
  await sequelize.transaction(async (transaction) => {
    const a = await loadForUser(id, user, transaction)
    if (a.status !== 'draft')
      throw domainRule('Only a draft can be changed; this application is ' + a.status)
    // Optimistic lock: the row changes only if nobody saved since the client loaded it.
    const [changed] = await Application.update(
      {
        title: input.title,
        siteAddress: input.siteAddress ?? null,
        contactName: input.contactName ?? null,
        contactPhone: input.contactPhone ?? null,
        startsOn: input.startsOn ?? null,
        endsOn: input.endsOn ?? null,
        description: input.description ?? null,
        version: input.version + 1,
      },
      { where: { id, version: input.version }, transaction },
    )
    if (changed === 0) {
      throw conflict(
        'Somebody saved this application after you opened it; reload to see their changes',
      )
    }
    await writeActivities(sequelize, id, input.activities, transaction)
  })
  return toApplicationDto(await loadForUser(id, user))
}

export async function getApplication(user: User, id: number): Promise<ApplicationDto> {
  return toApplicationDto(await loadForUser(id, user))
}

export interface ApplicationListQuery {
  page: number
  pageSize: number
  status?: ApplicationStatus | undefined
  q?: string | undefined
}

/** A page of the applications the user may see, newest change first. */
export async function listApplications(
  user: User,
  query: ApplicationListQuery,
): Promise<{ items: ApplicationListItem[]; total: number }> {
  const where: WhereOptions<Application>[] = []
  if (user.role === 'applicant') where.push({ applicantOrganisationId: user.organisationId })
  else if (user.role === 'permit_officer') where.push({ status: { [Op.ne]: 'draft' } })
  else if (user.role !== 'admin') throw forbidden()
  if (query.status) where.push({ status: query.status })
  if (query.q) {
    const like = `%${query.q.replace(/[%_\\]/g, (c) => `\\${c}`)}%`
    where.push({
      [Op.or]: [
        { title: { [Op.like]: like } },
        { reference: { [Op.like]: like } },
        { siteAddress: { [Op.like]: like } },
      ],
    })
  }
  const { rows, count } = await Application.findAndCountAll({
    where: { [Op.and]: where },
    include: [
      { model: Organisation, as: 'applicantOrganisation', attributes: ['id', 'name'] },
      { model: Activity, as: 'activities', attributes: ['id'] },
    ],
    order: [['updatedAt', 'DESC']],
    limit: query.pageSize,
    offset: (query.page - 1) * query.pageSize,
    distinct: true,
  })
  return {
    total: count,
    items: rows.map((a) => ({
      id: a.id,
      reference: a.reference ?? `draft-${a.id}`,
      status: a.status,
      title: a.title,
      siteAddress: a.siteAddress,
      startsOn: a.startsOn,
      endsOn: a.endsOn,
      activityCount: a.activities?.length ?? 0,
      applicantOrganisation: {
        id: a.applicantOrganisation!.id,
        name: a.applicantOrganisation!.name,
      },
      updatedAt: a.updatedAt.toISOString(),
    })),
  }
}

/** Our own reference scheme: TW-<year>-<id, five digits>. */
export const applicationReference = (id: number, submittedAt: Date) =>
  `TW-${format(submittedAt, 'yyyy')}-${String(id).padStart(5, '0')}`

/**
 * Submit a complete draft: the whole form is checked (dates not in the past, end after start,
 * at least one activity), the reference is assigned and the status moves to `submitted`.
 * The screening runs inside the same transaction, so a failure leaves the draft as it was.
 */
export async function submitApplication(
  sequelize: Sequelize,
  user: User,
  id: number,
  expectedVersion: number,
  now = new Date(),
): Promise<ApplicationDto> {
  if (user.role !== 'applicant') throw forbidden()
  await screeningTransaction(sequelize, async (transaction) => {
    const a = await loadForUser(id, user, transaction)
    if (a.status !== 'draft') throw domainRule('This application has already been submitted')
    if (a.version !== expectedVersion) {
      throw conflict(
        'Somebody saved this application after you opened it; reload before submitting',
      )
    }
    const form = toApplicationDto(a)
    const parsed = submitApplicationSchema.safeParse({
      ...form,
      siteAddress: form.siteAddress ?? undefined,
      contactName: form.contactName ?? undefined,
      contactPhone: form.contactPhone ?? undefined,
      startsOn: form.startsOn ?? undefined,
      endsOn: form.endsOn ?? undefined,
      description: form.description ?? undefined,
      activities: form.activities.map(({ id: _id, ...rest }) => rest),
    })
    if (!parsed.success) throw validationFailed(fieldIssuesFromZod(parsed.error))
    if (startOfDay(parseISO(parsed.data.startsOn)) < startOfDay(now)) {
      throw validationFailed([{ field: 'startsOn', message: 'The start date is in the past' }])
    }
    a.status = 'submitted'
    a.reference = applicationReference(a.id, now)
    a.submittedAt = now
    a.version = a.version + 1
    await a.save({ transaction })
    const screening = await screenApplication(sequelize, a.id, parsed.data.activities, transaction)
    // Combined with other live works on the same segments, and theirs with this one.
    await rescreenCombined(sequelize, a.id, transaction, now)
    await openOwnerReviews(a, user.id, transaction, now)
    const fee = await assessApplicationFee(
      a,
      parsed.data.activities.map((x) => x.kind),
      transaction,
      now,
    )
    await recordAudit(
      {
        actorUserId: user.id,
        action: 'application-submitted',
        entityType: 'application',
        entityId: a.id,
        details: {
          reference: a.reference,
          affectedSegments: screening.affected,
          verdict: screening.worst,
          fee_cents: fee?.amountCents ?? null,
          feeScheduleId: fee?.feeScheduleId ?? null,
        },
      },
      transaction,
    )
  })
  return toApplicationDto(await loadForUser(id, user))
}

/** Withdraw an application that has not been decided yet. */
export async function withdrawApplication(
  sequelize: Sequelize,
  user: User,
  id: number,
  reason: string | undefined,
): Promise<ApplicationDto> {
  if (user.role !== 'applicant') throw forbidden()
  const refunds = await screeningTransaction(sequelize, async (transaction) => {
    const a = await loadForUser(id, user, transaction)
    if (!WITHDRAWABLE.includes(a.status))
      throw domainRule(`An application that is ${a.status} cannot be withdrawn`)
    a.status = 'withdrawn'
    a.version = a.version + 1
    await a.save({ transaction })
    // Its works no longer add to anyone else's.
    await rescreenCombined(sequelize, a.id, transaction)
    await recordAudit(
      {
        actorUserId: user.id,
        action: 'application-withdrawn',
        entityType: 'application',
        entityId: a.id,
        details: { reason: reason ?? null },
      },
      transaction,
    )
    return closeApplicationFees(a.id, transaction)
  })
  // Refunds go to the payment service only after the withdrawal is committed.
  await payRefunds(sequelize, refunds)
  return toApplicationDto(await loadForUser(id, user))
}

/** The screening result of an application as the reader may see it. */
export async function getScreening(
  sequelize: Sequelize,
  user: User,
  id: number,
): Promise<ApplicationScreeningDto> {
  const a = await loadForUser(id, user)
  const activities = toApplicationDto(a).activities.map(({ id: _id, ...rest }) => rest)
  return applicantScreening(sequelize, a.id, activities, a.submittedAt)
}
