import { Op, UniqueConstraintError } from 'sequelize'
import type { Transaction } from 'sequelize'
import { effectiveUntil, scheduleInForce } from '../../shared/fees/index.ts'
import type { FeeScheduleInput } from '../../shared/schemas/fees.ts'
import type { FeeEntry, FeeScheduleDto, FeeScheduleTerms } from '../../shared/types/fees.ts'
import { config } from '../config.ts'
import { conflict, domainRule, forbidden } from '../errors.ts'
import { FeeSchedule, Organisation, User } from '../models/index.ts'
import { recordAudit } from './audit.ts'
import { isoToday } from './review-clock.ts'
import { parseJson } from './review-dto.ts'

/** The terms the computation needs, from a stored version. */
export function scheduleTerms(s: FeeSchedule): FeeScheduleTerms {
  return {
    effectiveFrom: s.effectiveFrom,
    currency: s.currency,
    entries: parseJson<FeeEntry[]>(s.entries),
    variationFee_cents: s.variationFeeCents,
    extensionFee_cents: s.extensionFeeCents,
    refundBeforeReview_percent: Number(s.refundBeforeReviewPercent),
    refundAfterReview_percent: Number(s.refundAfterReviewPercent),
    defaultPaymentTerms: s.defaultPaymentTerms,
  }
}

function toDto(s: FeeSchedule, all: readonly FeeSchedule[]): FeeScheduleDto {
  return {
    id: s.id,
    ...scheduleTerms(s),
    authorityOrganisation: { id: s.authorityOrganisationId, name: s.authority?.name ?? '' },
    effectiveTo: effectiveUntil(all, s.effectiveFrom),
    note: s.note,
    createdBy: { id: s.createdByUserId, name: s.createdBy?.name ?? '' },
    createdAt: s.createdAt.toISOString(),
  }
}

/** The officer's own street authority (schedules belong to it). */
async function authorityOf(user: User): Promise<Organisation> {
  if (user.role !== 'permit_officer') throw forbidden()
  const org = await Organisation.findByPk(user.organisationId)
  if (!org || org.kind !== 'street_authority')
    throw forbidden('Only a street authority keeps a fee schedule')
  return org
}

/** Every version of the officer's authority's schedule, newest first, with the one in force today marked by `inForceId`. */
export async function listFeeSchedules(
  user: User,
  now = new Date(),
): Promise<{ versions: FeeScheduleDto[]; inForceId: number | null }> {
  const org = await authorityOf(user)
  const all = await FeeSchedule.findAll({
    where: { authorityOrganisationId: org.id },
    include: [
      { model: Organisation, as: 'authority', attributes: ['id', 'name'] },
      { model: User, as: 'createdBy', attributes: ['id', 'name'] },
    ],
    order: [['effectiveFrom', 'DESC']],
  })
  return {
    versions: all.map((s) => toDto(s, all)),
    inForceId: scheduleInForce(all, isoToday(now))?.id ?? null,
  }
}

/**
 * Add a schedule version. It must start today or later: fees already computed keep their
 * version, and a version starting in the past would disagree with them.
 */
export async function createFeeSchedule(
  user: User,
  input: FeeScheduleInput,
  now = new Date(),
): Promise<FeeScheduleDto> {
  const org = await authorityOf(user)
  if (input.effectiveFrom < isoToday(now)) {
    throw domainRule('A new schedule can start today at the earliest', [
      { field: 'effectiveFrom', message: 'Must be today or later' },
    ])
  }
  let created: FeeSchedule
  try {
    created = await FeeSchedule.create({
      authorityOrganisationId: org.id,
      effectiveFrom: input.effectiveFrom,
      currency: input.currency,
      entries: input.entries,
      variationFeeCents: input.variationFee_cents,
      extensionFeeCents: input.extensionFee_cents,
      refundBeforeReviewPercent: input.refundBeforeReview_percent,
      refundAfterReviewPercent: input.refundAfterReview_percent,
      defaultPaymentTerms: input.defaultPaymentTerms,
      note: input.note ?? null,
      createdByUserId: user.id,
    })
  } catch (err) {
    if (err instanceof UniqueConstraintError) {
      throw conflict(`A version starting on ${input.effectiveFrom} exists already`, [
        { field: 'effectiveFrom', message: 'Pick another first day' },
      ])
    }
    throw err
  }
  await recordAudit({
    actorUserId: user.id,
    action: 'fee-schedule-created',
    entityType: 'fee_schedule',
    entityId: created.id,
    details: { effectiveFrom: input.effectiveFrom, currency: input.currency },
  })
  const { versions } = await listFeeSchedules(user, now)
  return versions.find((v) => v.id === created.id)!
}

/**
 * The schedule version in force on `date` for an authority. With no authority given:
 * FEE_AUTHORITY_ORGANISATION_ID when set, else the street authority with a version in force
 * that has the lowest id (Trenchward serves one street authority per deployment today; see
 * README "Fees and payments").
 */
export async function scheduleInForceOn(
  date: string,
  authorityOrganisationId: number | null,
  transaction?: Transaction,
): Promise<FeeSchedule | null> {
  authorityOrganisationId ??= config().FEE_AUTHORITY_ORGANISATION_ID ?? null
  const candidates = await FeeSchedule.findAll({
    where: {
      effectiveFrom: { [Op.lte]: date },
      ...(authorityOrganisationId ? { authorityOrganisationId } : {}),
    },
    order: [
      ['authorityOrganisationId', 'ASC'],
      ['effectiveFrom', 'DESC'],
    ],
    transaction,
  })
  return candidates[0] ?? null
}
