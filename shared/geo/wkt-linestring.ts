/**
 * Reads a LINESTRING in Well-Known Text, as CSV exports of GIS tools write it, into GeoJSON-style
 * positions. Accepts `LINESTRING (x y, ...)`, `LINESTRING Z (x y z, ...)` and an EWKT prefix
 * `SRID=4326;`. Other geometry types are named in the error so the report can say what was found.
 *
 * Source: OGC 06-103r4, Simple Feature Access – Common Architecture 1.2.1, §7 (WKT grammar).
 */

export type WktResult =
  { ok: true; coordinates: number[][]; srid: number | null } | { ok: false; message: string }

const NUMBER = /^[-+]?(\d+(\.\d*)?|\.\d+)([eE][-+]?\d+)?$/

/** Parse one WKT LINESTRING; never throws. */
export function parseWktLineString(text: string): WktResult {
  let s = text.trim()
  let srid: number | null = null
  const ewkt = /^SRID=(\d+);/i.exec(s)
  if (ewkt) {
    srid = Number(ewkt[1])
    s = s.slice(ewkt[0].length).trim()
  }
  if (!s) return { ok: false, message: 'The geometry is empty' }
  const head = /^([A-Za-z]+)\s*(Z|M|ZM)?\s*(\(|EMPTY\b)/i.exec(s)
  if (!head)
    return {
      ok: false,
      message: 'Not Well-Known Text: expected e.g. LINESTRING (9.95 52.60, 9.96 52.61)',
    }
  const type = head[1]!.toUpperCase()
  if (type !== 'LINESTRING')
    return { ok: false, message: `A pipe segment must be a LINESTRING, got ${type}` }
  if (head[3]!.toUpperCase() === 'EMPTY') return { ok: false, message: 'The LINESTRING is empty' }
  const dims = head[2] ? (head[2].toUpperCase() === 'ZM' ? 4 : 3) : 2
  const body = s.slice(head[0].length)
  const close = body.lastIndexOf(')')
  if (close < 0 || body.slice(close + 1).trim() !== '')
    return { ok: false, message: 'The LINESTRING is missing its closing parenthesis' }
  const coordinates: number[][] = []
  for (const [i, part] of body.slice(0, close).split(',').entries()) {
    const nums = part.trim().split(/\s+/)
    if (nums.length < 2 || nums.length > 4 || (head[2] && nums.length !== dims)) {
      return {
        ok: false,
        message: `Position ${i} must have ${head[2] ? dims : '2'} numbers, got "${part.trim()}"`,
      }
    }
    if (!nums.every((n) => NUMBER.test(n)))
      return { ok: false, message: `Position ${i} is not numeric: "${part.trim()}"` }
    coordinates.push(nums.slice(0, 3).map(Number))
  }
  return { ok: true, coordinates, srid }
}
