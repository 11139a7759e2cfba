import { z } from 'zod'
import { MATERIAL_DEFAULTS } from '../statics/index.ts'
import type { PipeMaterial } from '../statics/types.ts'
import { fieldIssuesFromZod } from './field-issues.ts'
import type { FieldIssue } from '../errors.ts'
import { pipeInputSchema } from './assessment-input.ts'
import { MATERIAL_PLAUSIBILITY } from './pipe-plausibility.ts'
import { PIPE_MEDIA, POSITIONAL_QUALITIES } from '../types/network.ts'
import type { PipeSegmentData } from '../types/network.ts'

/**
 * A pipe segment's stored design data, as an import feature or an edit gives them. The engine's
 * pipe fields are the engine's own field schemas (`pipeInputSchema.shape`, same names, ranges and
 * messages), optional ones stored as null when empty; the engine's single `cover_m` becomes a
 * cover at each end. The engine's cross-field rules run by parsing the engine input built from
 * the segment (cover = the smaller end). Added here: owner reference, medium, year laid,
 * positional accuracy, and per-material plausibility (pipe-plausibility.ts).
 */

export const PIPE_MATERIALS = Object.keys(MATERIAL_DEFAULTS) as PipeMaterial[]

const engine = pipeInputSchema.shape
const stored = <T extends z.ZodType>(s: z.ZodOptional<T>) => s.unwrap().nullable().default(null)

export const pipeSegmentDataObject = z.object({
  ownerRef: z
    .string({
      error: (i) =>
        i.input === undefined
          ? "Required: the owner's own reference for this segment"
          : 'Expected text',
    })
    .trim()
    .min(1, "Required: the owner's own reference for this segment")
    .max(64, 'At most 64 characters'),
  medium: z.enum(PIPE_MEDIA, {
    error: (i) => (i.input === undefined ? 'Required' : `Choose one of ${PIPE_MEDIA.join(', ')}`),
  }),
  material: engine.material,
  outerDiameter_m: engine.outerDiameter_m,
  wallThickness_m: engine.wallThickness_m,
  shortTermModulus_MPa: stored(engine.shortTermModulus_MPa),
  longTermModulus_MPa: stored(engine.longTermModulus_MPa),
  allowableStress_MPa: stored(engine.allowableStress_MPa),
  crushingStrength_kN_per_m: stored(engine.crushingStrength_kN_per_m),
  beddingFactor: stored(engine.beddingFactor),
  crushingSafetyFactor: stored(engine.crushingSafetyFactor),
  internalPressure_kPa: engine.internalPressure_kPa,
  /** Cover (ground to crown) at the segment's first and last vertex. */
  coverStart_m: engine.cover_m,
  coverEnd_m: engine.cover_m,
  installation: engine.installation,
  trenchWidth_m: stored(engine.trenchWidth_m),
  wallFrictionKMu: stored(engine.wallFrictionKMu),
  backfillUnitWeight_kN_per_m3: engine.backfillUnitWeight_kN_per_m3,
  frictionAngle_deg: engine.frictionAngle_deg,
  sidefillModulus_MPa: engine.sidefillModulus_MPa,
  beddingAngle_deg: engine.beddingAngle_deg,
  groundwaterAboveCrown_m: engine.groundwaterAboveCrown_m,
  designTrafficPressure_kPa: engine.designTrafficPressure_kPa,
  deflectionLagFactor: stored(engine.deflectionLagFactor),
  deflectionLimit_pct: stored(engine.deflectionLimit_pct),
  yearLaid: z
    .number({ error: 'Expected a year' })
    .int('A whole year')
    .min(1800, 'Must be 1800 or later')
    .max(2100, 'Must be 2100 or earlier')
    .nullable()
    .default(null),
  /** Plus/minus this many metres in plan. */
  positionalAccuracy_m: z
    .number({ error: 'Expected a number in m' })
    .min(0, 'Must be 0 or more')
    .max(50, 'Over ±50 m is not a usable position')
    .nullable()
    .default(null),
  positionalQuality: z
    .enum(POSITIONAL_QUALITIES, { error: () => `Choose one of ${POSITIONAL_QUALITIES.join(', ')}` })
    .default('unknown'),
})

type SegmentFields = z.output<typeof pipeSegmentDataObject>
const fmt = (n: number) => String(Number(n.toPrecision(6)))

/**
 * The engine pipe fields of a segment, for validation with the engine's schema: nulls dropped,
 * cover = the smaller end. Must agree with server/services/pipe-engine-input.ts (tested).
 */
export function enginePipeFieldsOf(d: SegmentFields): Record<string, unknown> {
  const out: Record<string, unknown> = {}
  for (const k of Object.keys(engine)) {
    if (k === 'cover_m') out.cover_m = Math.min(d.coverStart_m, d.coverEnd_m)
    else if ((d as Record<string, unknown>)[k] !== null) out[k] = (d as Record<string, unknown>)[k]
  }
  return out
}

/** The engine's cross-field rules, and per-material plausibility. */
export function checkSegmentRules(d: SegmentFields, ctx: z.RefinementCtx): void {
  const add = (path: string, message: string) =>
    ctx.addIssue({ code: 'custom', path: [path], message })
  const engineCheck = pipeInputSchema.safeParse(enginePipeFieldsOf(d))
  if (!engineCheck.success) {
    for (const i of engineCheck.error.issues) {
      const field = String(i.path[0] ?? 'feature')
      add(
        field === 'cover_m'
          ? d.coverStart_m <= d.coverEnd_m
            ? 'coverStart_m'
            : 'coverEnd_m'
          : field,
        i.message,
      )
    }
  }
  const p = MATERIAL_PLAUSIBILITY[d.material]
  const within = (field: keyof typeof p, value: number | null, what: string) => {
    if (value === null) return
    const [min, max] = p[field]
    if (value < min || value > max) {
      add(
        field === 'diameterToWall' ? 'wallThickness_m' : field,
        `${what} ${fmt(value)} is implausible for ${d.material} (expected ${min} to ${max})`,
      )
    }
  }
  within('outerDiameter_m', d.outerDiameter_m, 'Outer diameter')
  if (d.wallThickness_m < d.outerDiameter_m / 2)
    within('diameterToWall', d.outerDiameter_m / d.wallThickness_m, 'Diameter / wall ratio')
  within('shortTermModulus_MPa', d.shortTermModulus_MPa, 'Short-term modulus')
  within('longTermModulus_MPa', d.longTermModulus_MPa, 'Long-term modulus')
  within('allowableStress_MPa', d.allowableStress_MPa, 'Allowable stress')
}

/** The design data of one segment (import feature or complete edited segment). */
export const pipeSegmentDataSchema = pipeSegmentDataObject.superRefine(checkSegmentRules)
export type PipeSegmentDataInput = z.input<typeof pipeSegmentDataSchema>

/** Validate design data; issues are `{ field, message }` with the field's own name. */
export function parsePipeSegmentData(
  raw: unknown,
): { ok: true; data: PipeSegmentData } | { ok: false; issues: FieldIssue[] } {
  const r = pipeSegmentDataSchema.safeParse(raw)
  return r.success
    ? { ok: true, data: r.data }
    : { ok: false, issues: fieldIssuesFromZod(r.error, 'feature') }
}

/** A LineString in WGS84 lon/lat, as an edit may send it. */
export const lineStringLonLatSchema = z.object({
  type: z.literal('LineString'),
  coordinates: z
    .array(
      z
        .tuple([z.number().min(-180).max(180), z.number().min(-90).max(90)])
        .or(z.tuple([z.number(), z.number(), z.number()])),
    )
    .min(2, 'A line needs at least 2 positions')
    .max(10_000),
})

/**
 * PATCH body of one segment: any design-data fields (null clears an optional one), optionally a
 * new geometry, and the version the client last read (optimistic lock; a stale one gets 409).
 * The merged segment is validated with `pipeSegmentDataSchema`, the same rules as an import.
 */
const editFields = Object.fromEntries(
  Object.entries(pipeSegmentDataObject.shape).map(([k, v]) => [
    k,
    (v instanceof z.ZodDefault ? v.unwrap() : v).optional(),
  ]),
) as unknown as {
  [K in keyof typeof pipeSegmentDataObject.shape]: z.ZodOptional<
    z.ZodType<z.output<(typeof pipeSegmentDataObject.shape)[K]>>
  >
}

export const pipeSegmentEditSchema = z
  .object(editFields)
  .extend({
    version: z.number({ error: 'Required: the version you last read' }).int().min(1),
    geometry: lineStringLonLatSchema.optional(),
  })
  .strict()
export type PipeSegmentEdit = z.infer<typeof pipeSegmentEditSchema>

/** Fields whose values are numbers. */
export const NUMERIC_SEGMENT_FIELDS = Object.entries(pipeSegmentDataObject.shape)
  .filter(([, s]) => {
    const inner = s instanceof z.ZodDefault ? s.unwrap() : s
    const base = inner instanceof z.ZodNullable ? inner.unwrap() : inner
    return base instanceof z.ZodNumber
  })
  .map(([k]) => k as keyof PipeSegmentData)

/** Fields an import must give (the others have defaults or may stay empty). */
export const REQUIRED_SEGMENT_FIELDS = Object.entries(pipeSegmentDataObject.shape)
  .filter(([, s]) => !(s instanceof z.ZodDefault))
  .map(([k]) => k as keyof PipeSegmentData)

/** Unit of each numeric field, read from its name suffix (`_m`, `_kPa`, ...). */
export const SEGMENT_FIELD_UNITS: Partial<Record<keyof PipeSegmentData, string>> =
  Object.fromEntries(
    NUMERIC_SEGMENT_FIELDS.map((f) => {
      const m = /_(m|MPa|kPa|kN_per_m|kN_per_m3|deg|pct)$/.exec(f)
      return [f, m ? m[1]!.replace('_per_', '/').replace('m3', 'm³').replace('pct', '%') : null]
    }).filter(([, u]) => u !== null),
  )
