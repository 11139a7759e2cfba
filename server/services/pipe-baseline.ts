import * as statics from '../../shared/statics/index.ts'
import { assessPipe } from '../../shared/statics/index.ts'
import type { AssessmentResult, Verdict } from '../../shared/statics/types.ts'
import type { BaselineCheckDto, BaselineDto, PipeSegmentData } from '../../shared/types/network.ts'
import pkg from '../../package.json' with { type: 'json' }
import { pipeEngineInput } from './pipe-engine-input.ts'

/**
 * Version stamp stored with each baseline: the engine's own ENGINE_VERSION when it exports one,
 * else the application version. A segment whose stamp differs from the running one is due for a
 * re-check.
 */
export const BASELINE_ENGINE_VERSION: string = String(
  (statics as Record<string, unknown>).ENGINE_VERSION ?? `app-${pkg.version}`,
)

/** What the table stores of a baseline: the columns to filter and sort on, plus the checks. */
export interface BaselineColumns {
  verdict: Verdict | null
  governingCheck: string | null
  utilisation: number | null
  overCapacity: boolean
  /** Compact: the checks' baseline states and the cover used. The full text is recomputed on read. */
  result: StoredBaseline | null
  engineVersion: string
  error: string | null
}

export interface StoredBaseline {
  cover_m: number
  checks: BaselineCheckDto[]
}

/** Utilisation above which a segment is flagged as over capacity without any works. */
export const OVER_CAPACITY_UTILISATION = 1.0

function summarise(r: AssessmentResult): {
  checks: BaselineCheckDto[]
  utilisation: number | null
  governing: string | null
} {
  const checks = r.checks.map((c) => ({ id: c.id, method: c.method, unit: c.unit, ...c.baseline }))
  let best: BaselineCheckDto | null = null
  for (const c of checks) if (!best || c.utilisation > best.utilisation) best = c
  return { checks, utilisation: best ? best.utilisation : null, governing: best ? best.id : null }
}

/**
 * The baseline check of a segment: the statics engine on the stored design data with no
 * activities. Never throws: should the engine refuse the data (the import validation runs the
 * engine's schema first, so this is not expected), the error is stored and the segment is
 * not flagged, and the owner sees the message.
 */
export function computeBaseline(data: PipeSegmentData): BaselineColumns {
  const pipe = pipeEngineInput(data)
  try {
    const r = assessPipe({ pipe, activities: [] }, { solveConditions: false })
    const s = summarise(r)
    return {
      verdict: r.verdict,
      governingCheck: s.governing,
      utilisation: s.utilisation,
      overCapacity: s.utilisation !== null && s.utilisation > OVER_CAPACITY_UTILISATION,
      result: { cover_m: pipe.cover_m, checks: s.checks },
      engineVersion: BASELINE_ENGINE_VERSION,
      error: null,
    }
  } catch (err) {
    return {
      verdict: null,
      governingCheck: null,
      utilisation: null,
      overCapacity: false,
      result: null,
      engineVersion: BASELINE_ENGINE_VERSION,
      error: String((err as Error).message).slice(0, 500),
    }
  }
}

/**
 * The baseline as the detail view shows it: the stored columns, with the engine's assumptions
 * and cautions recomputed from the stored data (the engine is pure and fast, so the table keeps
 * only what lists and filters need).
 */
export function baselineDto(
  data: PipeSegmentData,
  stored: Omit<BaselineColumns, 'engineVersion'> & { engineVersion: string | null },
): BaselineDto {
  let assumptions: string[] = []
  let cautions: string[] = []
  if (!stored.error) {
    try {
      const r = assessPipe(
        { pipe: pipeEngineInput(data), activities: [] },
        { solveConditions: false },
      )
      const cover = pipeEngineInput(data).cover_m
      assumptions = [
        ...r.assumptions,
        `Cover: the engine used the smaller of the two recorded covers (${cover.toFixed(2)} m); the soil load alone is larger at the deeper end.`,
      ]
      cautions = r.cautions
    } catch {
      // The stored error below already explains it.
    }
  }
  return {
    verdict: stored.verdict,
    governingCheck: stored.governingCheck,
    utilisation: stored.utilisation,
    overCapacity: stored.overCapacity,
    engineVersion: stored.engineVersion,
    error: stored.error,
    checks: stored.result?.checks ?? [],
    assumptions,
    cautions,
  }
}
