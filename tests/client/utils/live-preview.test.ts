import { describe, expect, it } from 'vitest'
import { crsTransform } from '../../../shared/geo/crs.ts'
import type { ActivityInput } from '../../../shared/schemas/application.ts'
import type { OutlineFeature } from '../../../shared/types/network.ts'
import {
  mergeReach,
  previewBox,
  previewReach,
  PREVIEW_MIN_DISTANCE_m,
} from '../../../src/utils/live-preview.ts'
import { parseCoordinateText, geometryFromPositions } from '../../../src/utils/coordinate-text.ts'

const t = crsTransform(25832)

/** A rectangle in grid metres around (x0, y0), as a WGS84 polygon. */
function gridRectangle(x0: number, y0: number, w_m: number, h_m: number) {
  const ring = [
    [x0, y0],
    [x0 + w_m, y0],
    [x0 + w_m, y0 + h_m],
    [x0, y0 + h_m],
    [x0, y0],
  ].map((p) => t.toLonLat(p))
  return { type: 'Polygon' as const, coordinates: [ring] }
}

/** A straight east-west pipe in grid metres at northing y, as an outline feature. */
function pipe(
  id: number,
  ownerName: string,
  medium: OutlineFeature['properties']['medium'],
  x0: number,
  y: number,
): OutlineFeature {
  return {
    type: 'Feature',
    id,
    properties: { ownerName, medium },
    geometry: {
      type: 'LineString',
      coordinates: [t.toLonLat([x0 - 50, y]), t.toLonLat([x0 + 50, y])],
    },
  }
}

const [X, Y] = t.toGrid([9.95, 52.6])

describe('previewReach', () => {
  const trench: ActivityInput = {
    kind: 'excavation',
    geometry: gridRectangle(X, Y, 4, 2),
    depth_m: 0.5,
    support: 'trench-box',
    digging: 'mechanical',
  }

  it('lists the owners and media of the pipes within the influence distance, never less than the minimum', () => {
    const [reach] = previewReach(
      [{ key: 'a', input: trench }],
      [
        pipe(1, 'Wendmoor Water', 'water', X, Y - 3), // 3 m south of the trench
        pipe(2, 'Wendmoor Gas', 'gas', X, Y + 2 + 400), // far north
        pipe(3, 'Wendmoor Water', 'water', X, Y + 1), // through the trench
      ],
      t,
    )
    expect(reach?.influence_m).toBeGreaterThanOrEqual(PREVIEW_MIN_DISTANCE_m)
    expect(reach?.pipeIds).toEqual([1, 3])
    expect(reach?.pipes).toHaveLength(1)
    expect(reach?.pipes[0]).toMatchObject({
      ownerName: 'Wendmoor Water',
      medium: 'water',
      pipeCount: 2,
    })
    // Tolerance 0.01 m: the round trip through WGS84 moves grid points by well under a millimetre.
    expect(reach?.pipes[0]?.nearest_m).toBeCloseTo(0, 2)
    expect(reach?.zones).toHaveLength(1)
    expect(reach?.mats).toHaveLength(0)
  })

  it('draws a mat per outrigger and counts a pipe reached by two legs once', () => {
    const crane: ActivityInput = {
      kind: 'crane',
      setup: 'outriggers',
      geometry: { type: 'MultiPoint', coordinates: [t.toLonLat([X, Y]), t.toLonLat([X + 6, Y])] },
      legLoad_kN: 300,
      matLength_m: 1.5,
      matWidth_m: 1.5,
      matRotation_deg: 0,
    }
    const outline = [pipe(7, 'Wendmoor Gas', 'gas', X + 3, Y - 2)]
    const reaches = previewReach([{ key: 'c', input: crane }], outline, t)
    expect(reaches[0]?.mats).toHaveLength(2)
    expect(reaches[0]?.zones).toHaveLength(2)
    expect(reaches[0]?.pipes).toEqual([
      expect.objectContaining({ ownerName: 'Wendmoor Gas', medium: 'gas', pipeCount: 1 }),
    ])
    expect(mergeReach(reaches, outline)).toEqual([
      expect.objectContaining({ ownerName: 'Wendmoor Gas', pipeCount: 1 }),
    ])
  })

  it('finds nothing when every pipe is further away than the reach', () => {
    const [reach] = previewReach(
      [{ key: 'a', input: trench }],
      [pipe(9, 'Far Away', 'sewer', X, Y - 200)],
      t,
    )
    expect(reach?.pipes).toEqual([])
  })
})

describe('previewBox', () => {
  it('grows the view to take in drawn positions plus a margin', () => {
    expect(previewBox([9.9, 52.5, 9.91, 52.51], [[9.95, 52.6]], 0.002)).toEqual([
      9.9, 52.5, 9.952, 52.602,
    ])
  })
})

describe('typed coordinates', () => {
  it('reads grid metres, converts them to lon/lat and closes the outline', () => {
    const text = `${X.toFixed(2)} ${Y.toFixed(2)}\n${(X + 4).toFixed(2)} ${Y.toFixed(2)}\n${(X + 4).toFixed(2)} ${(Y + 2).toFixed(2)}`
    const parsed = parseCoordinateText(text, 'grid', t)
    expect(parsed.ok).toBe(true)
    if (!parsed.ok) return
    const polygon = geometryFromPositions('excavation', 'outriggers', parsed.positions)
    expect(polygon?.type).toBe('Polygon')
    const ring = polygon?.type === 'Polygon' ? polygon.coordinates[0]! : []
    expect(ring).toHaveLength(4)
    expect(ring[0]).toEqual(ring[3])
    expect(ring[0]![0]).toBeCloseTo(9.95, 6)
  })

  it('names the line that cannot be read', () => {
    expect(parseCoordinateText('9.95, 52.6\n9.95 north', 'lonlat', t)).toEqual({
      ok: false,
      message: 'Line 2: write two numbers, e.g. 9.950120, 52.600340',
    })
  })
})
