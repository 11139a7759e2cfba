/**
 * Checks the activities for the engine's direct callers (the zod schema does the same for the API
 * and the CLI): unique ids, finite numbers in plausible ranges, valid footprints.
 */
import { footprintArea_m2, isPolygonFootprint, isSimplePolygon } from './footprint-geometry.ts'
import { requireInRange } from './guards.ts'
import type { Activity } from './types.ts'

/** Plausible ranges of the activity fields, shared with the zod schema. */
export const ACTIVITY_FIELD_RANGES = {
  load_kN: [0, 20_000],
  pressure_kPa: [0, 1000],
  height_m: [0, 30],
  unitWeight_kN_per_m3: [10, 25],
  depth_m: [0, 30],
  coordinate_m: [-1000, 1000],
} as const satisfies Record<string, readonly [number, number]>

/** Smallest footprint area accepted, m² (a 0.1 m × 0.1 m pad). */
export const MIN_FOOTPRINT_AREA_m2 = 0.01
/** Largest number of polygon vertices accepted. */
export const MAX_POLYGON_VERTICES = 500
/** Largest number of activities in one assessment. */
export const MAX_ACTIVITIES = 500

const SUPPORTS: ReadonlySet<string> = new Set([
  'none',
  'sloped',
  'trench-box',
  'sheet-piling',
  'braced',
])
const [COORDINATE_MIN, COORDINATE_MAX] = ACTIVITY_FIELD_RANGES.coordinate_m

/** Checks one ranged activity number; the field name is only built when the value is rejected. */
function checkPositive(
  index: number,
  field: keyof typeof ACTIVITY_FIELD_RANGES,
  value: number,
): void {
  const [min, max] = ACTIVITY_FIELD_RANGES[field]
  if (typeof value === 'number' && (min === 0 ? value > min : value >= min) && value <= max) return
  requireInRange(`activities[${index}].${field}`, value, min, max, { minExclusive: min === 0 })
}

/** Checks one footprint coordinate; the field name is only built when the value is rejected. */
function checkCoordinate(name: () => string, value: number): void {
  if (typeof value === 'number' && value >= COORDINATE_MIN && value <= COORDINATE_MAX) return
  requireInRange(name(), value, COORDINATE_MIN, COORDINATE_MAX)
}

/**
 * Throws a RangeError naming the field (e.g. `activities[0].load_kN`) when an activity is invalid.
 *
 * @param activities - the activities
 */
export function checkActivities(activities: readonly Activity[]): void {
  if (!Array.isArray(activities)) throw new RangeError('activities must be an array')
  if (activities.length > MAX_ACTIVITIES) {
    throw new RangeError(`activities must have at most ${MAX_ACTIVITIES} entries`)
  }
  const ids = new Set<string>()
  for (let index = 0; index < activities.length; index++) {
    const activity = activities[index] as Activity
    if (activity === null || typeof activity !== 'object') {
      throw new RangeError(`activities[${index}] must be an object`)
    }
    if (typeof activity.id !== 'string' || activity.id.length === 0) {
      throw new RangeError(`activities[${index}].id must be a non-empty string`)
    }
    if (ids.has(activity.id)) {
      throw new RangeError(`activities[${index}].id must be unique (duplicate '${activity.id}')`)
    }
    ids.add(activity.id)
    switch (activity.kind) {
      case 'pad':
        checkPositive(index, 'load_kN', activity.load_kN)
        break
      case 'area':
        checkPositive(index, 'pressure_kPa', activity.pressure_kPa)
        break
      case 'fill':
        checkPositive(index, 'height_m', activity.height_m)
        checkPositive(index, 'unitWeight_kN_per_m3', activity.unitWeight_kN_per_m3)
        break
      case 'excavation':
        checkPositive(index, 'depth_m', activity.depth_m)
        if (!SUPPORTS.has(activity.support)) {
          throw new RangeError(`activities[${index}].support is not a known support system`)
        }
        break
      default:
        throw new RangeError(
          `activities[${index}].kind must be 'pad', 'area', 'fill' or 'excavation'`,
        )
    }
    checkFootprint(index, activity.footprint)
  }
}

function footprintName(index: number): string {
  return `activities[${index}].footprint`
}

function checkFootprint(index: number, footprint: Activity['footprint']): void {
  if (footprint === null || typeof footprint !== 'object')
    throw new RangeError(`${footprintName(index)} is required`)
  if (isPolygonFootprint(footprint)) {
    const vertices = footprint.polygon_m
    if (!Array.isArray(vertices) || vertices.length < 3 || vertices.length > MAX_POLYGON_VERTICES) {
      throw new RangeError(
        `${footprintName(index)}.polygon_m must have 3 to ${MAX_POLYGON_VERTICES} vertices`,
      )
    }
    for (let i = 0; i < vertices.length; i++) {
      const vertex = vertices[i]
      if (!Array.isArray(vertex) || vertex.length !== 2) {
        throw new RangeError(`${footprintName(index)}.polygon_m[${i}] must be an [x, y] pair`)
      }
      checkCoordinate(() => `${footprintName(index)}.polygon_m[${i}][0]`, vertex[0])
      checkCoordinate(() => `${footprintName(index)}.polygon_m[${i}][1]`, vertex[1])
    }
    if (!isSimplePolygon(vertices)) {
      throw new RangeError(
        `${footprintName(index)}.polygon_m must be a simple polygon (no crossing edges)`,
      )
    }
  } else {
    checkCoordinate(() => `${footprintName(index)}.xMin_m`, footprint.xMin_m)
    checkCoordinate(() => `${footprintName(index)}.xMax_m`, footprint.xMax_m)
    checkCoordinate(() => `${footprintName(index)}.yMin_m`, footprint.yMin_m)
    checkCoordinate(() => `${footprintName(index)}.yMax_m`, footprint.yMax_m)
    if (!(footprint.xMax_m > footprint.xMin_m))
      throw new RangeError(`${footprintName(index)}.xMax_m must exceed xMin_m`)
    if (!(footprint.yMax_m > footprint.yMin_m))
      throw new RangeError(`${footprintName(index)}.yMax_m must exceed yMin_m`)
  }
  if (footprintArea_m2(footprint) < MIN_FOOTPRINT_AREA_m2) {
    throw new RangeError(
      `${footprintName(index)} must have an area of at least ${MIN_FOOTPRINT_AREA_m2} m²`,
    )
  }
}
