import { describe, expect, it } from 'vitest'
import { parseWktLineString } from '../../../shared/geo/wkt-linestring.ts'

describe('parseWktLineString', () => {
  it('reads 2D, Z and EWKT forms', () => {
    expect(parseWktLineString('LINESTRING (9.95 52.6, 9.96 52.61)')).toEqual({
      ok: true,
      srid: null,
      coordinates: [
        [9.95, 52.6],
        [9.96, 52.61],
      ],
    })
    expect(parseWktLineString('linestring z(1 2 3,4 5 6)')).toEqual({
      ok: true,
      srid: null,
      coordinates: [
        [1, 2, 3],
        [4, 5, 6],
      ],
    })
    expect(parseWktLineString('SRID=4326;LINESTRING(1 2,3 4)')).toEqual({
      ok: true,
      srid: 4326,
      coordinates: [
        [1, 2],
        [3, 4],
      ],
    })
  })
  it('names what is wrong', () => {
    expect(parseWktLineString('POINT (1 2)')).toEqual({
      ok: false,
      message: 'A pipe segment must be a LINESTRING, got POINT',
    })
    expect(parseWktLineString('LINESTRING (1 2, 3 x)')).toEqual({
      ok: false,
      message: 'Position 1 is not numeric: "3 x"',
    })
    expect(parseWktLineString('LINESTRING (1 2, 3 4')).toEqual({
      ok: false,
      message: 'The LINESTRING is missing its closing parenthesis',
    })
    expect(parseWktLineString('LINESTRING EMPTY')).toEqual({
      ok: false,
      message: 'The LINESTRING is empty',
    })
    expect(parseWktLineString('')).toEqual({ ok: false, message: 'The geometry is empty' })
    expect(parseWktLineString('hello')).toEqual({
      ok: false,
      message: 'Not Well-Known Text: expected e.g. LINESTRING (9.95 52.60, 9.96 52.61)',
    })
  })
})
