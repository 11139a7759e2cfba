import { describe, it, expect } from 'vitest'
import {
  assessmentInputSchema,
  fieldPath,
  formatZodIssues,
} from '../../../shared/schemas/assessment-input.ts'

const pipe = {
  material: 'PE100',
  outerDiameter_m: 0.4,
  wallThickness_m: 0.024,
  internalPressure_kPa: 600,
  cover_m: 1.8,
  installation: 'trench',
  trenchWidth_m: 1.0,
  wallFrictionKMu: 0.165,
  backfillUnitWeight_kN_per_m3: 19,
  frictionAngle_deg: 30,
  sidefillModulus_MPa: 5,
  beddingAngle_deg: 90,
  groundwaterAboveCrown_m: 0,
  designTrafficPressure_kPa: 0,
}
const pad = {
  id: 'pad-1',
  kind: 'pad',
  load_kN: 300,
  footprint: { xMin_m: 1.5, xMax_m: 2.5, yMin_m: -0.5, yMax_m: 0.5 },
}

function fields(input: unknown): string[] {
  const result = assessmentInputSchema.safeParse(input)
  if (result.success) return []
  return formatZodIssues(result.error).map((issue) => issue.field)
}

describe('assessmentInputSchema', () => {
  it('accepts the issue 3 example with a rectangle and a polygon footprint', () => {
    const heap = {
      id: 'heap',
      kind: 'area',
      pressure_kPa: 36,
      footprint: {
        polygon_m: [
          [3, 0],
          [6, 0],
          [6, 4],
          [3, 4],
        ],
      },
    }
    const dig = {
      id: 'dig',
      kind: 'excavation',
      depth_m: 3,
      support: 'none',
      footprint: { xMin_m: -5, xMax_m: -3, yMin_m: 0, yMax_m: 4 },
    }
    const fill = {
      id: 'fill',
      kind: 'fill',
      height_m: 2,
      unitWeight_kN_per_m3: 19,
      footprint: { xMin_m: 8, xMax_m: 12, yMin_m: 0, yMax_m: 4 },
    }
    const result = assessmentInputSchema.safeParse({ pipe, activities: [pad, heap, fill, dig] })
    expect(result.success).toBe(true)
    if (result.success)
      expect(result.data.activities[1]?.footprint).toEqual({
        polygon_m: [
          [3, 0],
          [6, 0],
          [6, 4],
          [3, 4],
        ],
      })
  })

  it('names a pipe field that is out of range', () => {
    expect(fields({ pipe: { ...pipe, cover_m: -1 }, activities: [] })).toEqual(['pipe.cover_m'])
  })

  it('names a missing required field and an unknown (misspelt) one', () => {
    const { cover_m: _omit, ...withoutCover } = pipe
    void _omit
    expect(fields({ pipe: { ...withoutCover, cover: 1.8 }, activities: [] })).toEqual([
      'pipe.cover_m',
      'pipe.cover',
    ])
  })

  it('names activity fields with their index', () => {
    expect(fields({ pipe, activities: [{ ...pad, load_kN: 0 }] })).toEqual([
      'activities[0].load_kN',
    ])
    expect(fields({ pipe, activities: [pad, { ...pad, kind: 'crane' }] })).toEqual([
      'activities[1].kind',
    ])
    expect(fields({ pipe, activities: [pad, pad] })).toEqual(['activities[1].id'])
  })

  it('names footprint problems precisely', () => {
    expect(
      fields({
        pipe,
        activities: [{ ...pad, footprint: { xMin_m: 2, xMax_m: 1, yMin_m: 0, yMax_m: 1 } }],
      }),
    ).toEqual(['activities[0].footprint.xMax_m'])
    expect(
      fields({
        pipe,
        activities: [
          {
            ...pad,
            footprint: {
              polygon_m: [
                [0, 0],
                [1, 1],
                [1, 0],
                [0, 1],
              ],
            },
          },
        ],
      }),
    ).toEqual(['activities[0].footprint.polygon_m'])
    expect(fields({ pipe, activities: [{ ...pad, footprint: { xMin_m: 0, xMax_m: 1 } }] })).toEqual(
      ['activities[0].footprint.yMin_m', 'activities[0].footprint.yMax_m'],
    )
  })

  it('applies the cross-field rules once the fields are valid', () => {
    expect(fields({ pipe: { ...pipe, trenchWidth_m: 0.3 }, activities: [] })).toEqual([
      'pipe.trenchWidth_m',
    ])
    expect(fields({ pipe: { ...pipe, material: 'concrete' }, activities: [] })).toEqual([
      'pipe.crushingStrength_kN_per_m',
    ])
    expect(fields({ pipe: { ...pipe, material: 'GRP' }, activities: [] })).toEqual([
      'pipe.shortTermModulus_MPa',
      'pipe.longTermModulus_MPa',
      'pipe.allowableStress_MPa',
    ])
    expect(fields({ pipe: { ...pipe, groundwaterAboveCrown_m: 2 }, activities: [] })).toEqual([
      'pipe.groundwaterAboveCrown_m',
    ])
  })

  it('formats paths as dotted fields with indexes', () => {
    expect(fieldPath(['activities', 2, 'footprint', 'polygon_m', 0])).toBe(
      'activities[2].footprint.polygon_m[0]',
    )
    expect(fieldPath([])).toBe('(input)')
  })
})
