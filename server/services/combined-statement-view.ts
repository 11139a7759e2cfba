import { combinedStatementText } from '../../shared/screening/combined-statement.ts'
import type { AssessmentInput, AssessmentResult, Verdict } from '../../shared/statics/types.ts'
import type { CombinedStatement, StoredCombinedScreening } from '../../shared/types/coordination.ts'
import { VERDICT_RANK } from '../../shared/types/screening.ts'

function parseJson<T>(v: unknown): T {
  return (typeof v === 'string' ? JSON.parse(v) : v) as T
}

/**
 * The plain statement about concurrent works for one assessment, for applicant and owner views.
 * Other applications appear only by reference, dates and activity kinds. Null when no other
 * works overlap in time and place.
 */
export function combinedStatement(a: {
  medium: string
  verdict: Verdict
  combinedVerdict: Verdict | null
  combined: unknown
}): CombinedStatement | null {
  if (!a.combinedVerdict || !a.combined) return null
  const stored = parseJson<StoredCombinedScreening>(a.combined)
  const withWorks = stored.applications.filter((w) =>
    stored.worst.applicationIds.includes(w.applicationId),
  )
  // The engine adds loads, so together is never better than alone; guard the wording anyway.
  const combined =
    VERDICT_RANK[a.combinedVerdict] >= VERDICT_RANK[a.verdict] ? a.combinedVerdict : a.verdict
  return {
    verdictAlone: a.verdict,
    verdictCombined: combined,
    from: stored.worst.from,
    to: stored.worst.to,
    withWorks,
    statement: combinedStatementText(
      a.medium,
      a.verdict,
      combined,
      stored.worst.from,
      stored.worst.to,
      withWorks,
    ),
  }
}

/** The owner's view of the combined screening: the statement plus the worst run's engine record. */
export function ownerCombinedView(a: {
  medium: string
  verdict: Verdict
  combinedVerdict: Verdict | null
  combined: unknown
}): (CombinedStatement & { engineInput: AssessmentInput; result: AssessmentResult }) | null {
  const statement = combinedStatement(a)
  if (!statement) return null
  const stored = parseJson<StoredCombinedScreening>(a.combined)
  return { ...statement, engineInput: stored.engineInput, result: stored.result }
}
