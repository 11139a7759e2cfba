/**
 * Validation schema of the statics engine input (issue 3): one pipe's design data plus the
 * planned activities in the pipe-local frame. The API route and the CLI `scripts/assess` both
 * parse with it, so the same field names and messages reach every user. Objects are strict:
 * a misspelt field (e.g. `cover` for `cover_m`) is an error rather than a silently applied default.
 */
import { z } from 'zod'
import type { FieldIssue } from '../errors.ts'
import {
  ACTIVITY_FIELD_RANGES,
  MAX_ACTIVITIES,
  MAX_POLYGON_VERTICES,
  MIN_FOOTPRINT_AREA_m2,
  PIPE_FIELD_RANGES,
  footprintArea_m2,
  isSimplePolygon,
  isFlexibleMaterial,
} from '../statics/index.ts'
import type { AssessmentInput } from '../statics/index.ts'

const PIPE_MATERIALS = [
  'PE100',
  'PVC-U',
  'GRP',
  'steel',
  'ductile-iron',
  'concrete',
  'vitrified-clay',
] as const
const SUPPORTS = ['none', 'sloped', 'trench-box', 'sheet-piling', 'braced'] as const
const DURATIONS = ['short-term', 'long-term'] as const

function ranged(
  range: readonly [number, number],
  unit: string,
  options: { exclusiveMin?: boolean } = {},
) {
  const [min, max] = range
  const base = z.number({
    error: (issue) => (issue.input === undefined ? 'Required' : `Enter a number in ${unit}`),
  })
  const lower = options.exclusiveMin
    ? base.gt(min, `Must be more than ${min} ${unit}`)
    : base.min(min, `Must be at least ${min} ${unit}`)
  return lower.max(max, `Must be at most ${max} ${unit}`)
}

const pipeRange = (field: keyof typeof PIPE_FIELD_RANGES, unit: string) =>
  ranged(PIPE_FIELD_RANGES[field], unit)

/** Schema of the pipe design data. */
export const pipeInputSchema = z
  .strictObject({
    material: z.enum(PIPE_MATERIALS, { error: `Choose one of ${PIPE_MATERIALS.join(', ')}` }),
    outerDiameter_m: pipeRange('outerDiameter_m', 'm'),
    wallThickness_m: pipeRange('wallThickness_m', 'm'),
    shortTermModulus_MPa: pipeRange('shortTermModulus_MPa', 'MPa').optional(),
    longTermModulus_MPa: pipeRange('longTermModulus_MPa', 'MPa').optional(),
    allowableStress_MPa: pipeRange('allowableStress_MPa', 'MPa').optional(),
    crushingStrength_kN_per_m: pipeRange('crushingStrength_kN_per_m', 'kN/m').optional(),
    beddingFactor: pipeRange('beddingFactor', '').optional(),
    crushingSafetyFactor: pipeRange('crushingSafetyFactor', '').optional(),
    internalPressure_kPa: pipeRange('internalPressure_kPa', 'kPa'),
    cover_m: pipeRange('cover_m', 'm'),
    installation: z.enum(['trench', 'embankment'], { error: "Choose 'trench' or 'embankment'" }),
    trenchWidth_m: pipeRange('trenchWidth_m', 'm').optional(),
    wallFrictionKMu: pipeRange('wallFrictionKMu', '').optional(),
    backfillUnitWeight_kN_per_m3: pipeRange('backfillUnitWeight_kN_per_m3', 'kN/m³'),
    frictionAngle_deg: pipeRange('frictionAngle_deg', '°'),
    sidefillModulus_MPa: pipeRange('sidefillModulus_MPa', 'MPa'),
    beddingAngle_deg: pipeRange('beddingAngle_deg', '°'),
    groundwaterAboveCrown_m: pipeRange('groundwaterAboveCrown_m', 'm'),
    designTrafficPressure_kPa: pipeRange('designTrafficPressure_kPa', 'kPa'),
    deflectionLagFactor: pipeRange('deflectionLagFactor', '').optional(),
    deflectionLimit_pct: pipeRange('deflectionLimit_pct', '%').optional(),
  })
  .superRefine((pipe, ctx) => {
    const add = (field: string, message: string): void => {
      ctx.addIssue({ code: 'custom', path: [field], message })
    }
    const diameterValid = pipe.outerDiameter_m >= PIPE_FIELD_RANGES.outerDiameter_m[0]
    if (diameterValid && pipe.wallThickness_m >= pipe.outerDiameter_m / 2) {
      add('wallThickness_m', 'Must be less than half the outside diameter')
    }
    if (pipe.installation === 'trench') {
      if (pipe.trenchWidth_m === undefined)
        add('trenchWidth_m', 'Required for a trench installation')
      else if (diameterValid && pipe.trenchWidth_m < pipe.outerDiameter_m) {
        add('trenchWidth_m', 'Must be at least the outside diameter')
      }
      if (pipe.wallFrictionKMu === undefined)
        add('wallFrictionKMu', 'Required for a trench installation')
    }
    if (!isFlexibleMaterial(pipe.material) && pipe.crushingStrength_kN_per_m === undefined) {
      add(
        'crushingStrength_kN_per_m',
        `Required for ${pipe.material} pipes (three-edge-bearing strength)`,
      )
    }
    if (pipe.material === 'GRP') {
      const reason =
        'Required for GRP: laminate properties are product-specific, so there is no default'
      if (pipe.shortTermModulus_MPa === undefined) add('shortTermModulus_MPa', reason)
      if (pipe.longTermModulus_MPa === undefined) add('longTermModulus_MPa', reason)
      if (pipe.allowableStress_MPa === undefined) add('allowableStress_MPa', reason)
    }
    if (
      pipe.shortTermModulus_MPa !== undefined &&
      pipe.longTermModulus_MPa !== undefined &&
      pipe.longTermModulus_MPa > pipe.shortTermModulus_MPa
    ) {
      add('longTermModulus_MPa', 'Must not exceed the short-term modulus')
    }
    const coverValid = pipe.cover_m >= PIPE_FIELD_RANGES.cover_m[0]
    if (coverValid && pipe.groundwaterAboveCrown_m > pipe.cover_m)
      add('groundwaterAboveCrown_m', 'Must not exceed the cover')
  })

const coordinate = ranged(ACTIVITY_FIELD_RANGES.coordinate_m, 'm')

/**
 * Schema of a footprint: a rectangle {xMin_m, xMax_m, yMin_m, yMax_m} or a polygon {polygon_m}.
 * Written as one object with optional fields so that errors name the exact field.
 */
export const footprintSchema = z
  .strictObject({
    xMin_m: coordinate.optional(),
    xMax_m: coordinate.optional(),
    yMin_m: coordinate.optional(),
    yMax_m: coordinate.optional(),
    polygon_m: z
      .array(z.tuple([coordinate, coordinate], { error: 'Each vertex must be [x, y] in metres' }))
      .min(3, 'Needs at least 3 vertices')
      .max(MAX_POLYGON_VERTICES, `Use at most ${MAX_POLYGON_VERTICES} vertices`)
      .optional(),
  })
  .superRefine((footprint, ctx) => {
    const add = (path: string, message: string): void => {
      ctx.addIssue({ code: 'custom', path: [path], message })
    }
    const rectangleFields = ['xMin_m', 'xMax_m', 'yMin_m', 'yMax_m'] as const
    const given = rectangleFields.filter((field) => footprint[field] !== undefined)
    if (footprint.polygon_m !== undefined) {
      if (given.length > 0)
        add(given[0] as string, 'Give either a rectangle or polygon_m, not both')
      const vertices = footprint.polygon_m
      if (vertices.length >= 3) {
        if (!isSimplePolygon(vertices))
          add('polygon_m', 'Must be a simple polygon (no repeated points, no crossing edges)')
        else if (footprintArea_m2({ polygon_m: vertices }) < MIN_FOOTPRINT_AREA_m2) {
          add('polygon_m', `Must enclose at least ${MIN_FOOTPRINT_AREA_m2} m²`)
        }
      }
      return
    }
    for (const field of rectangleFields)
      if (footprint[field] === undefined) add(field, 'Required (or give polygon_m)')
    const { xMin_m, xMax_m, yMin_m, yMax_m } = footprint
    if (
      xMin_m === undefined ||
      xMax_m === undefined ||
      yMin_m === undefined ||
      yMax_m === undefined
    )
      return
    if (xMax_m <= xMin_m) add('xMax_m', 'Must be greater than xMin_m')
    if (yMax_m <= yMin_m) add('yMax_m', 'Must be greater than yMin_m')
    if (
      xMax_m > xMin_m &&
      yMax_m > yMin_m &&
      (xMax_m - xMin_m) * (yMax_m - yMin_m) < MIN_FOOTPRINT_AREA_m2
    ) {
      add('xMax_m', `The rectangle must cover at least ${MIN_FOOTPRINT_AREA_m2} m²`)
    }
  })
  .transform((footprint) =>
    footprint.polygon_m !== undefined
      ? { polygon_m: footprint.polygon_m.map(([x, y]) => [x, y] as [number, number]) }
      : {
          xMin_m: footprint.xMin_m as number,
          xMax_m: footprint.xMax_m as number,
          yMin_m: footprint.yMin_m as number,
          yMax_m: footprint.yMax_m as number,
        },
  )

const activityId = z
  .string({ error: 'Required: a short name such as pad-1' })
  .trim()
  .min(1, 'Required: a short name such as pad-1')
  .max(64, 'Use at most 64 characters')
const activityRange = (field: keyof typeof ACTIVITY_FIELD_RANGES, unit: string) =>
  ranged(ACTIVITY_FIELD_RANGES[field], unit, {
    exclusiveMin: ACTIVITY_FIELD_RANGES[field][0] === 0,
  })

/** Schema of one activity, discriminated by `kind`. */
export const activitySchema = z.discriminatedUnion(
  'kind',
  [
    z.strictObject({
      id: activityId,
      kind: z.literal('pad'),
      load_kN: activityRange('load_kN', 'kN'),
      loadDuration: z.enum(DURATIONS).optional(),
      footprint: footprintSchema,
    }),
    z.strictObject({
      id: activityId,
      kind: z.literal('area'),
      pressure_kPa: activityRange('pressure_kPa', 'kPa'),
      loadDuration: z.enum(DURATIONS).optional(),
      footprint: footprintSchema,
    }),
    z.strictObject({
      id: activityId,
      kind: z.literal('fill'),
      height_m: activityRange('height_m', 'm'),
      unitWeight_kN_per_m3: activityRange('unitWeight_kN_per_m3', 'kN/m³'),
      loadDuration: z.enum(DURATIONS).optional(),
      footprint: footprintSchema,
    }),
    z.strictObject({
      id: activityId,
      kind: z.literal('excavation'),
      depth_m: activityRange('depth_m', 'm'),
      support: z.enum(SUPPORTS, { error: `Choose one of ${SUPPORTS.join(', ')}` }),
      footprint: footprintSchema,
    }),
  ],
  { error: "Choose a kind: 'pad', 'area', 'fill' or 'excavation'" },
)

/** Schema of the whole engine input. */
export const assessmentInputSchema = z
  .strictObject({
    pipe: pipeInputSchema,
    activities: z
      .array(activitySchema, { error: 'Required: a list of activities (it may be empty)' })
      .max(MAX_ACTIVITIES, `Use at most ${MAX_ACTIVITIES} activities`),
  })
  .superRefine((input, ctx) => {
    const seen = new Map<string, number>()
    input.activities.forEach((activity, index) => {
      if (seen.has(activity.id)) {
        ctx.addIssue({
          code: 'custom',
          path: ['activities', index, 'id'],
          message: `Duplicate id '${activity.id}'`,
        })
      }
      seen.set(activity.id, index)
    })
  })

export type PipeInputData = z.infer<typeof pipeInputSchema>
export type ActivityData = z.infer<typeof activitySchema>
export type AssessmentInputData = z.infer<typeof assessmentInputSchema>

// Compile-time guard: whatever the schema accepts, the engine accepts.
const schemaMatchesEngine: (value: AssessmentInputData) => AssessmentInput = (value) => value
void schemaMatchesEngine

/** Formats a zod path as a field name: ['activities', 0, 'load_kN'] → 'activities[0].load_kN'. */
export function fieldPath(path: ReadonlyArray<PropertyKey>): string {
  let out = ''
  for (const part of path) {
    if (typeof part === 'number') out += `[${part}]`
    else out += out === '' ? String(part) : `.${String(part)}`
  }
  return out === '' ? '(input)' : out
}

/**
 * Turns zod issues into `{ field, message }` pairs, one per problem, with unknown keys named
 * individually (e.g. `pipe.cover` "Unknown field").
 *
 * @param error - a ZodError from `safeParse`
 */
export function formatZodIssues(error: z.ZodError): FieldIssue[] {
  const issues: FieldIssue[] = []
  for (const issue of error.issues) {
    if (issue.code === 'unrecognized_keys') {
      for (const key of issue.keys)
        issues.push({ field: fieldPath([...issue.path, key]), message: 'Unknown field' })
    } else {
      issues.push({ field: fieldPath(issue.path), message: issue.message })
    }
  }
  return issues
}
