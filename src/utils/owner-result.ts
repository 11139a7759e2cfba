import type { OwnerScreening } from '../../shared/types/screening.ts'

const VERDICT_WORDS = { clear: 'clear', conditional: 'conditional', critical: 'critical' } as const

/** The owner's result in one line, e.g. "Wendmoor Water: 1 pipe affected — conditional". */
export function ownerResultSentence(owner: OwnerScreening): string {
  const n = owner.affected.length
  if (owner.verdict === 'not-affected' || n === 0)
    return `${owner.organisation.name}: no pipes affected`
  return `${owner.organisation.name}: ${n} pipe${n === 1 ? '' : 's'} affected — ${VERDICT_WORDS[owner.verdict]}`
}
