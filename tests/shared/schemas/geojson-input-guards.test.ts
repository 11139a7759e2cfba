import { describe, expect, it } from 'vitest'
import { simplePolygonSchema } from '../../../shared/schemas/geojson-input.ts'

describe('simplePolygonSchema on broken outlines', () => {
  it('refuses an empty ring, no ring and a ring of one point with issues, never by throwing', () => {
    for (const coordinates of [[[]], [], [[[9.9, 52.6]]], [[[9.9, 52.6], 'x']]]) {
      const r = simplePolygonSchema.safeParse({ type: 'Polygon', coordinates })
      expect(r.success).toBe(false)
      expect(r.error!.issues.length).toBeGreaterThan(0)
    }
  })
})
