/**
 * Fills the optional pipe fields with material defaults and checks every number the engine uses.
 * Direct callers of the engine (not through the zod schema) get a RangeError naming the field.
 */
import { requireInRange } from './guards.ts'
import {
  DEFAULT_BEDDING_FACTOR,
  DEFAULT_CRUSHING_SAFETY_FACTOR,
  DEFAULT_DEFLECTION_LAG_FACTOR,
  MATERIAL_DEFAULTS,
} from './materials.ts'
import type { PipeInput, PipeMaterial } from './types.ts'

/** Pipe data with every value the checks need. */
export interface ResolvedPipe {
  material: PipeMaterial
  behaviour: 'flexible' | 'rigid'
  outerDiameter_m: number
  wallThickness_m: number
  shortTermModulus_MPa: number
  longTermModulus_MPa: number
  /** Null when the material has no default and none was given (checks needing it are skipped). */
  allowableStress_MPa: number | null
  allowableStressGiven: boolean
  crushingStrength_kN_per_m: number | null
  beddingFactor: number
  crushingSafetyFactor: number
  internalPressure_kPa: number
  cover_m: number
  installation: 'trench' | 'embankment'
  trenchWidth_m: number | null
  wallFrictionKMu: number
  backfillUnitWeight_kN_per_m3: number
  frictionAngle_deg: number
  sidefillModulus_MPa: number
  beddingAngle_deg: number
  groundwaterAboveCrown_m: number
  designTrafficPressure_kPa: number
  deflectionLagFactor: number
  deflectionLimit_pct: number | null
  wallUnitWeight_kN_per_m3: number
  jointed: boolean
  /** Plain-English notes, one per default applied. */
  defaultsApplied: string[]
}

/** Plausible ranges of the pipe fields, shared with the zod schema. */
export const PIPE_FIELD_RANGES = {
  outerDiameter_m: [0.02, 5],
  wallThickness_m: [0.001, 0.5],
  shortTermModulus_MPa: [50, 300_000],
  longTermModulus_MPa: [10, 300_000],
  allowableStress_MPa: [0.1, 1000],
  crushingStrength_kN_per_m: [1, 5000],
  beddingFactor: [1, 5],
  crushingSafetyFactor: [1, 3],
  internalPressure_kPa: [0, 25_000],
  cover_m: [0.1, 30],
  trenchWidth_m: [0.1, 20],
  wallFrictionKMu: [0, 0.25],
  backfillUnitWeight_kN_per_m3: [10, 25],
  frictionAngle_deg: [10, 50],
  sidefillModulus_MPa: [0, 50],
  beddingAngle_deg: [0, 180],
  groundwaterAboveCrown_m: [0, 30],
  designTrafficPressure_kPa: [0, 1000],
  deflectionLagFactor: [1, 2.5],
  deflectionLimit_pct: [0.5, 10],
} as const satisfies Record<string, readonly [number, number]>

type RangedField = keyof typeof PIPE_FIELD_RANGES

function check(field: RangedField, value: number): number {
  const [min, max] = PIPE_FIELD_RANGES[field]
  // Fast path first: the field name is only built when the value is rejected.
  if (typeof value === 'number' && value >= min && value <= max) return value
  return requireInRange(`pipe.${field}`, value, min, max)
}

function optional(field: RangedField, value: number | undefined): number | undefined {
  return value === undefined ? undefined : check(field, value)
}

/** Returns the given value (checked), else the default (noted in `notes`), else null. */
function pick(
  notes: string[],
  field: RangedField,
  given: number | undefined,
  fallback: number | null,
  label: string,
  unit: string,
  why: string,
): number | null {
  const value = optional(field, given)
  if (value !== undefined) return value
  if (fallback === null) return null
  notes.push(`Default applied: ${label} ${fallback}${unit ? ` ${unit}` : ''} (${why}).`)
  return fallback
}

/**
 * Returns the pipe with defaults applied, after checking every field.
 *
 * @param pipe - the pipe's design data
 * @throws RangeError naming the field (e.g. `pipe.cover_m`) when a value is missing or out of range
 *
 * Source: defaults from materials.ts (methods.md 6.3, 7.1, 7.2, 9, 11).
 */
export function resolvePipe(pipe: PipeInput): ResolvedPipe {
  const defaults = MATERIAL_DEFAULTS[pipe.material]
  if (!defaults)
    throw new RangeError(`pipe.material is not a known material (got ${String(pipe.material)})`)
  const notes: string[] = []
  const outerDiameter_m = check('outerDiameter_m', pipe.outerDiameter_m)
  const wallThickness_m = check('wallThickness_m', pipe.wallThickness_m)
  if (wallThickness_m >= outerDiameter_m / 2) {
    throw new RangeError('pipe.wallThickness_m must be less than half of pipe.outerDiameter_m')
  }
  const cover_m = check('cover_m', pipe.cover_m)

  const shortTermModulus_MPa = pick(
    notes,
    'shortTermModulus_MPa',
    pipe.shortTermModulus_MPa,
    defaults.shortTermModulus_MPa,
    'short-term modulus',
    'MPa',
    `typical value for ${pipe.material}`,
  )
  if (shortTermModulus_MPa === null) {
    throw new RangeError(`pipe.shortTermModulus_MPa is required for ${pipe.material} (no default)`)
  }
  const longTermModulus_MPa = pick(
    notes,
    'longTermModulus_MPa',
    pipe.longTermModulus_MPa,
    defaults.longTermModulus_MPa,
    'long-term modulus',
    'MPa',
    `typical value for ${pipe.material}`,
  )
  if (longTermModulus_MPa === null) {
    throw new RangeError(`pipe.longTermModulus_MPa is required for ${pipe.material} (no default)`)
  }
  if (longTermModulus_MPa > shortTermModulus_MPa) {
    throw new RangeError('pipe.longTermModulus_MPa must not exceed pipe.shortTermModulus_MPa')
  }
  const allowableStressGiven = pipe.allowableStress_MPa !== undefined
  const allowableStress_MPa = pick(
    notes,
    'allowableStress_MPa',
    pipe.allowableStress_MPa,
    defaults.allowableStress_MPa,
    'allowable wall stress',
    'MPa',
    `conservative value for ${pipe.material}`,
  )
  const internalPressure_kPa = check('internalPressure_kPa', pipe.internalPressure_kPa)
  if (internalPressure_kPa > 0 && allowableStress_MPa === null) {
    throw new RangeError(
      `pipe.allowableStress_MPa is required for a ${pipe.material} pressure pipe (no default)`,
    )
  }

  let crushingStrength_kN_per_m: number | null = null
  if (defaults.behaviour === 'rigid') {
    if (pipe.crushingStrength_kN_per_m === undefined) {
      throw new RangeError(`pipe.crushingStrength_kN_per_m is required for ${pipe.material} pipes`)
    }
    crushingStrength_kN_per_m = check('crushingStrength_kN_per_m', pipe.crushingStrength_kN_per_m)
  } else if (pipe.crushingStrength_kN_per_m !== undefined) {
    crushingStrength_kN_per_m = check('crushingStrength_kN_per_m', pipe.crushingStrength_kN_per_m)
  }
  const rigid = defaults.behaviour === 'rigid'
  const beddingFactor = rigid
    ? (pick(
        notes,
        'beddingFactor',
        pipe.beddingFactor,
        DEFAULT_BEDDING_FACTOR,
        'bedding factor',
        '',
        'lowest published class, D',
      ) as number)
    : DEFAULT_BEDDING_FACTOR
  const crushingSafetyFactor = rigid
    ? (pick(
        notes,
        'crushingSafetyFactor',
        pipe.crushingSafetyFactor,
        DEFAULT_CRUSHING_SAFETY_FACTOR,
        'crushing safety factor',
        '',
        'as in the published worked example',
      ) as number)
    : DEFAULT_CRUSHING_SAFETY_FACTOR

  let trenchWidth_m: number | null = null
  let wallFrictionKMu = 0
  if (pipe.installation === 'trench') {
    if (pipe.trenchWidth_m === undefined)
      throw new RangeError('pipe.trenchWidth_m is required for a trench installation')
    trenchWidth_m = check('trenchWidth_m', pipe.trenchWidth_m)
    if (trenchWidth_m < outerDiameter_m) {
      throw new RangeError('pipe.trenchWidth_m must be at least pipe.outerDiameter_m')
    }
    if (pipe.wallFrictionKMu === undefined) {
      notes.push(
        "Default applied: no trench-wall friction counted (K·μ' not given), so the silo factor is 1.",
      )
    } else {
      wallFrictionKMu = check('wallFrictionKMu', pipe.wallFrictionKMu)
    }
  } else if (pipe.installation !== 'embankment') {
    throw new RangeError(
      `pipe.installation must be 'trench' or 'embankment' (got ${String(pipe.installation)})`,
    )
  }

  const groundwaterAboveCrown_m = check('groundwaterAboveCrown_m', pipe.groundwaterAboveCrown_m)
  if (groundwaterAboveCrown_m > cover_m) {
    throw new RangeError('pipe.groundwaterAboveCrown_m must not exceed pipe.cover_m')
  }
  const flexible = defaults.behaviour === 'flexible'
  const deflectionLagFactor = flexible
    ? (pick(
        notes,
        'deflectionLagFactor',
        pipe.deflectionLagFactor,
        DEFAULT_DEFLECTION_LAG_FACTOR,
        'deflection lag factor',
        '',
        'conservative fallback',
      ) as number)
    : DEFAULT_DEFLECTION_LAG_FACTOR
  const deflectionLimit_pct = flexible
    ? pick(
        notes,
        'deflectionLimit_pct',
        pipe.deflectionLimit_pct,
        defaults.deflectionLimit_pct,
        'deflection limit',
        '%',
        `typical limit for ${pipe.material}`,
      )
    : null

  return {
    material: pipe.material,
    behaviour: defaults.behaviour,
    outerDiameter_m,
    wallThickness_m,
    shortTermModulus_MPa,
    longTermModulus_MPa,
    allowableStress_MPa,
    allowableStressGiven,
    crushingStrength_kN_per_m,
    beddingFactor,
    crushingSafetyFactor,
    internalPressure_kPa,
    cover_m,
    installation: pipe.installation,
    trenchWidth_m,
    wallFrictionKMu,
    backfillUnitWeight_kN_per_m3: check(
      'backfillUnitWeight_kN_per_m3',
      pipe.backfillUnitWeight_kN_per_m3,
    ),
    frictionAngle_deg: check('frictionAngle_deg', pipe.frictionAngle_deg),
    sidefillModulus_MPa: check('sidefillModulus_MPa', pipe.sidefillModulus_MPa),
    beddingAngle_deg: check('beddingAngle_deg', pipe.beddingAngle_deg),
    groundwaterAboveCrown_m,
    designTrafficPressure_kPa: check('designTrafficPressure_kPa', pipe.designTrafficPressure_kPa),
    deflectionLagFactor,
    deflectionLimit_pct,
    wallUnitWeight_kN_per_m3: defaults.wallUnitWeight_kN_per_m3,
    jointed: defaults.jointed,
    defaultsApplied: notes,
  }
}
