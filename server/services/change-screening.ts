import { Op } from 'sequelize'
import type { Sequelize, Transaction } from 'sequelize'
import type { ActivityInput } from '../../shared/schemas/application.ts'
import type { AssessmentResult, Verdict } from '../../shared/statics/types.ts'
import type { ChangeOwnerScreening } from '../../shared/types/site-works.ts'
import { VERDICT_RANK } from '../../shared/types/screening.ts'
import { Assessment, Organisation } from '../models/index.ts'
import { parseJson } from './review-dto.ts'
import { screenActivities } from './screening.ts'

/** One segment's outcome, before or after a change. */
interface SegmentOutcome {
  owner: number
  verdict: Verdict
  utilisation: number
  /** Utilisation with works of every check, by check id. */
  checks: Map<string, number>
}

const checksOf = (r: AssessmentResult) =>
  new Map(r.checks.map((c) => [String(c.id), c.withWorks.utilisation]))

function sameChecks(a: Map<string, number>, b: Map<string, number>): boolean {
  if (a.size !== b.size) return false
  for (const [id, u] of a) {
    const v = b.get(id)
    if (v === undefined || Math.abs(u - v) > SAME_UTILISATION) return false
  }
  return true
}

/** Differences below this are rounding, not a change (utilisation is a ratio). */
const SAME_UTILISATION = 1e-6

function summary(list: SegmentOutcome[]) {
  let worst: Verdict | null = null
  for (const s of list)
    if (!worst || VERDICT_RANK[s.verdict] > VERDICT_RANK[worst]) worst = s.verdict
  return {
    segments: list.length,
    worst,
    maxUtilisation: list.reduce((m, s) => Math.max(m, s.utilisation), 0),
  }
}

/**
 * Screen changed activities with the engine and compare, owner by owner, with the screening
 * the permit rests on (the application's stored assessments).
 *
 * Project rule for "the change touches an owner's pipes": the changed works reach a segment
 * of that owner the permit's works did not reach, no longer reach one they did, or give any
 * segment of that owner a different verdict or a different utilisation in any check. An owner whose every
 * segment gets exactly the same result is untouched and is not asked again. A change of dates
 * alone touches nobody here (the engine's checks do not depend on the dates); overlaps with
 * other works in time are re-screened when the new issue is written.
 */
export async function compareChangedWorks(
  sequelize: Sequelize,
  applicationId: number,
  activities: readonly ActivityInput[] | null,
  transaction?: Transaction,
): Promise<ChangeOwnerScreening[]> {
  const stored = await Assessment.findAll({
    where: { applicationId },
    attributes: [
      'pipeSegmentId',
      'ownerOrganisationId',
      'verdict',
      'utilisationWithWorks',
      'result',
    ],
    transaction,
  })
  const before = new Map<number, SegmentOutcome>(
    stored.map((a) => [
      a.pipeSegmentId,
      {
        owner: a.ownerOrganisationId,
        verdict: a.verdict,
        utilisation: Number(a.utilisationWithWorks ?? 0),
        checks: checksOf(parseJson<AssessmentResult>(a.result)),
      },
    ]),
  )
  let after = before
  if (activities) {
    const { segments } = await screenActivities(sequelize, activities)
    after = new Map(
      segments.map((s) => {
        const governing = s.result.checks.find((c) => c.governing)
        return [
          s.segmentId,
          {
            owner: s.ownerOrganisationId,
            verdict: s.result.verdict,
            utilisation: governing?.withWorks.utilisation ?? 0,
            checks: checksOf(s.result),
          },
        ]
      }),
    )
  }
  const ownerIds = [...new Set([...before.values(), ...after.values()].map((s) => s.owner))]
  const names = new Map(
    ownerIds.length
      ? (
          await Organisation.findAll({
            where: { id: { [Op.in]: ownerIds } },
            attributes: ['id', 'name'],
            transaction,
          })
        ).map((o) => [o.id, o.name])
      : [],
  )
  return ownerIds
    .map((owner) => {
      const b = [...before].filter(([, s]) => s.owner === owner)
      const a = [...after].filter(([, s]) => s.owner === owner)
      const added = a.filter(([id]) => !before.has(id)).length
      const dropped = b.filter(([id]) => !after.has(id)).length
      const changed = a.filter(([id, s]) => {
        const old = before.get(id)
        return old && (old.verdict !== s.verdict || !sameChecks(old.checks, s.checks))
      }).length
      const touched = added + dropped + changed > 0
      const parts = [
        added ? `${added} more segment${added === 1 ? '' : 's'} reached` : '',
        dropped ? `${dropped} segment${dropped === 1 ? '' : 's'} no longer reached` : '',
        changed ? `a different result on ${changed} segment${changed === 1 ? '' : 's'}` : '',
      ].filter(Boolean)
      return {
        owner: { id: owner, name: names.get(owner) ?? `Owner ${owner}` },
        before: summary(b.map(([, s]) => s)),
        after: summary(a.map(([, s]) => s)),
        touched,
        why: touched
          ? `The changed works give ${parts.join(', ')}.`
          : 'The changed works give exactly the same result on every segment of this owner.',
      }
    })
    .sort((x, y) => x.owner.name.localeCompare(y.owner.name))
}
