import { describe, expect, it } from 'vitest'
import {
  capIssues,
  featureIssues,
  geoJsonIssues,
  geometryIssues,
} from '../../../shared/geo/geojson-structure.ts'

// Rules from RFC 7946 (sections named in the module); the outside corpus check is in
// tests/server/network-conformance.test.ts.
describe('geometryIssues', () => {
  it('accepts a 2D or 3D LineString of two positions', () => {
    expect(
      geometryIssues(
        {
          type: 'LineString',
          coordinates: [
            [9.9, 52.6],
            [9.91, 52.6, 3],
          ],
        },
        'geometry',
      ),
    ).toEqual([])
  })
  it('names a too-short LineString, a non-numeric coordinate and an out-of-range latitude', () => {
    expect(geometryIssues({ type: 'LineString', coordinates: [[1, 2]] }, 'g')).toEqual([
      { path: 'g.coordinates', message: 'A LineString needs at least 2 positions, got 1' },
    ])
    expect(
      geometryIssues(
        {
          type: 'LineString',
          coordinates: [
            [1, 2],
            [1, '3'],
          ],
        },
        'g',
      ),
    ).toEqual([
      { path: 'g.coordinates.1.1', message: 'A coordinate must be a number, got the text "3"' },
    ])
    expect(geometryIssues({ type: 'Point', coordinates: [566000, 5830000] }, '')).toEqual([
      {
        path: 'coordinates.0',
        message: 'Longitude 566000 is outside -180..180 (is the file in a projected CRS?)',
      },
    ])
  })
  it('requires closed rings of four positions, and does not judge winding (RFC 7946 §3.1.6)', () => {
    expect(
      geometryIssues(
        {
          type: 'Polygon',
          coordinates: [
            [
              [0, 0],
              [1, 0],
              [1, 1],
              [0, 1],
            ],
          ],
        },
        '',
      ),
    ).toEqual([
      {
        path: 'coordinates.0',
        message: 'A linear ring must be closed: its last position must equal its first',
      },
    ])
    expect(
      geometryIssues(
        {
          type: 'Polygon',
          coordinates: [
            [
              [0, 0],
              [0, 1],
              [1, 1],
              [1, 0],
              [0, 0],
            ],
          ],
        },
        '',
      ),
    ).toEqual([])
  })
  it('is case-sensitive about types', () => {
    expect(geometryIssues({ type: 'linestring', coordinates: [] }, '')[0]!.message).toMatch(
      /^Unknown geometry type "linestring"/,
    )
  })
})

describe('featureIssues', () => {
  it('requires properties and geometry members and a string or number id', () => {
    expect(featureIssues({ type: 'Feature', id: [1] }, 'features.3')).toEqual([
      { path: 'features.3.id', message: 'A feature id must be a string or a number, got an array' },
      {
        path: 'features.3.properties',
        message: 'A feature needs a "properties" member (an object or null)',
      },
      {
        path: 'features.3.geometry',
        message: 'A feature needs a "geometry" member (an object or null)',
      },
    ])
  })
  it('refuses members that change the meaning of a Feature (RFC 7946 §7.1)', () => {
    expect(
      featureIssues({ type: 'Feature', properties: null, geometry: null, coordinates: [] }, ''),
    ).toEqual([
      {
        path: 'coordinates',
        message: 'A Feature must not have a "coordinates" member (RFC 7946 §7.1)',
      },
    ])
  })
})

describe('geoJsonIssues and capIssues', () => {
  it('checks a whole FeatureCollection', () => {
    expect(
      geoJsonIssues({
        type: 'FeatureCollection',
        features: [{ type: 'Feature', properties: {}, geometry: null }],
      }),
    ).toEqual([])
    expect(geoJsonIssues({ type: 'FeatureCollection', features: {} })).toEqual([
      { path: 'features', message: '"features" must be an array, got an object' },
    ])
  })
  it('keeps the first issues and sums up the rest', () => {
    const many = Array.from({ length: 8 }, (_, i) => ({ path: `c.${i}`, message: 'bad' }))
    expect(capIssues(many, 5)).toEqual([
      ...many.slice(0, 5),
      { path: 'c.0', message: '... and 3 more problems of this kind' },
    ])
  })
})
