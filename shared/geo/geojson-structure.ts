/**
 * Structural checks of GeoJSON objects against RFC 7946 (the "MUST" rules), for parsed values of
 * unknown shape. Each problem names the member by a dotted path (`geometry.coordinates.3`) so an
 * import report can point at it. Domain rules (pipes are LineStrings, the service area) are not
 * checked here.
 *
 * Source: RFC 7946, The GeoJSON Format (2016): §3 (object types), §3.1.1 (positions: two or
 * three numbers here; the RFC advises against more), §3.1.4–3.1.6 (LineString ≥ 2 positions,
 * linear rings closed with ≥ 4 positions), §3.2 (Feature members), §3.3 (FeatureCollection),
 * §5 (bbox of 2·n numbers), §7.1 (members that must not appear on other types). Ring winding
 * (§3.1.6 right-hand rule) is advice that parsers must not reject on, so it is not checked.
 */

/** One structural problem: where (dotted path from the object checked) and what. */
export interface StructureIssue {
  path: string
  message: string
}

export const GEOMETRY_TYPES = [
  'Point',
  'MultiPoint',
  'LineString',
  'MultiLineString',
  'Polygon',
  'MultiPolygon',
  'GeometryCollection',
] as const
export type GeometryType = (typeof GEOMETRY_TYPES)[number]

/** Members RFC 7946 §7.1 forbids on each kind of object (they would change its meaning). */
const FORBIDDEN_MEMBERS: Record<'geometry' | 'Feature' | 'FeatureCollection', readonly string[]> = {
  geometry: ['geometry', 'properties', 'features'],
  Feature: ['coordinates', 'geometries', 'features'],
  FeatureCollection: ['coordinates', 'geometries', 'geometry', 'properties'],
}

const join = (base: string, key: string | number) => (base ? `${base}.${key}` : String(key))
const isObject = (v: unknown): v is Record<string, unknown> =>
  typeof v === 'object' && v !== null && !Array.isArray(v)
const describe = (v: unknown) =>
  v === null
    ? 'null'
    : Array.isArray(v)
      ? 'an array'
      : typeof v === 'string'
        ? `the text "${v.slice(0, 40)}"`
        : typeof v === 'object'
          ? 'an object'
          : `a ${typeof v}`

function forbidden(
  obj: Record<string, unknown>,
  kind: keyof typeof FORBIDDEN_MEMBERS,
  path: string,
  label: string,
): StructureIssue[] {
  return FORBIDDEN_MEMBERS[kind]
    .filter((m) => m in obj)
    .map((m) => ({
      path: join(path, m),
      message: `A ${label} must not have a "${m}" member (RFC 7946 §7.1)`,
    }))
}

/** Problems with a bbox member (RFC 7946 §5): an array of 2·n numbers, n ≥ 2. */
export function bboxIssues(bbox: unknown, path: string): StructureIssue[] {
  if (!Array.isArray(bbox))
    return [{ path, message: `bbox must be an array of numbers, got ${describe(bbox)}` }]
  const issues: StructureIssue[] = []
  if (bbox.length < 4 || bbox.length % 2 !== 0) {
    issues.push({ path, message: `bbox must have 4 or 6 numbers, got ${bbox.length}` })
  }
  bbox.forEach((v, i) => {
    if (typeof v !== 'number')
      issues.push({
        path: join(path, i),
        message: `bbox values must be numbers, got ${describe(v)}`,
      })
  })
  return issues
}

/** Problems with one position: two or three numbers, longitude and latitude in range. */
export function positionIssues(p: unknown, path: string): StructureIssue[] {
  if (!Array.isArray(p))
    return [{ path, message: `A position must be an array of 2 or 3 numbers, got ${describe(p)}` }]
  if (p.length < 2 || p.length > 3) {
    return [
      {
        path,
        message: `A position must have 2 or 3 numbers (longitude, latitude, optional height), got ${p.length}`,
      },
    ]
  }
  const bad = p.findIndex((v) => typeof v !== 'number' || !Number.isFinite(v))
  if (bad >= 0)
    return [
      { path: join(path, bad), message: `A coordinate must be a number, got ${describe(p[bad])}` },
    ]
  const [lon, lat] = p as number[]
  if (lon! < -180 || lon! > 180)
    return [
      {
        path: join(path, 0),
        message: `Longitude ${lon} is outside -180..180 (is the file in a projected CRS?)`,
      },
    ]
  if (lat! < -90 || lat! > 90)
    return [
      {
        path: join(path, 1),
        message: `Latitude ${lat} is outside -90..90 (is the file in a projected CRS?)`,
      },
    ]
  return []
}

function positionsIssues(v: unknown, path: string, min: number, what: string): StructureIssue[] {
  if (!Array.isArray(v))
    return [{ path, message: `${what} must be an array of positions, got ${describe(v)}` }]
  const issues = v.flatMap((p, i) => positionIssues(p, join(path, i)))
  if (issues.length) return issues
  if (v.length < min)
    return [{ path, message: `${what} needs at least ${min} positions, got ${v.length}` }]
  return []
}

function ringIssues(v: unknown, path: string): StructureIssue[] {
  const issues = positionsIssues(v, path, 4, 'A linear ring')
  if (issues.length) return issues
  const ring = v as number[][]
  const first = ring[0]!
  const last = ring[ring.length - 1]!
  if (first.length !== last.length || first.some((c, i) => c !== last[i])) {
    return [
      { path, message: 'A linear ring must be closed: its last position must equal its first' },
    ]
  }
  return []
}

function arrayOf(
  v: unknown,
  path: string,
  what: string,
  each: (item: unknown, p: string) => StructureIssue[],
  min = 0,
): StructureIssue[] {
  if (!Array.isArray(v)) return [{ path, message: `${what} must be an array, got ${describe(v)}` }]
  const issues = v.flatMap((item, i) => each(item, join(path, i)))
  if (!issues.length && v.length < min)
    issues.push({ path, message: `${what} needs at least ${min} entries` })
  return issues
}

/** Problems with a geometry object (RFC 7946 §3.1). `path` is where it sits in the document. */
export function geometryIssues(g: unknown, path: string): StructureIssue[] {
  if (!isObject(g)) return [{ path, message: `A geometry must be an object, got ${describe(g)}` }]
  const type = g.type
  if (typeof type !== 'string') {
    return [
      {
        path: join(path, 'type'),
        message:
          type === undefined
            ? 'A geometry needs a "type" member'
            : `"type" must be a string, got ${describe(type)}`,
      },
    ]
  }
  if (!(GEOMETRY_TYPES as readonly string[]).includes(type)) {
    return [
      {
        path: join(path, 'type'),
        message: `Unknown geometry type "${type}" (types are case-sensitive: ${GEOMETRY_TYPES.join(', ')})`,
      },
    ]
  }
  const issues = forbidden(g, 'geometry', path, 'geometry')
  if ('bbox' in g) issues.push(...bboxIssues(g.bbox, join(path, 'bbox')))
  if (type === 'GeometryCollection') {
    if (!('geometries' in g))
      return [
        ...issues,
        {
          path: join(path, 'geometries'),
          message: 'A GeometryCollection needs a "geometries" array',
        },
      ]
    return [
      ...issues,
      ...arrayOf(g.geometries, join(path, 'geometries'), '"geometries"', geometryIssues),
    ]
  }
  const cp = join(path, 'coordinates')
  if (!('coordinates' in g))
    return [...issues, { path: cp, message: `A ${type} needs a "coordinates" member` }]
  const c = g.coordinates
  switch (type) {
    case 'Point':
      issues.push(...positionIssues(c, cp))
      break
    case 'MultiPoint':
      issues.push(...positionsIssues(c, cp, 0, 'MultiPoint coordinates'))
      break
    case 'LineString':
      issues.push(...positionsIssues(c, cp, 2, 'A LineString'))
      break
    case 'MultiLineString':
      issues.push(
        ...arrayOf(c, cp, 'MultiLineString coordinates', (l, p) =>
          positionsIssues(l, p, 2, 'A LineString'),
        ),
      )
      break
    case 'Polygon':
      issues.push(...arrayOf(c, cp, 'Polygon coordinates (an array of linear rings)', ringIssues))
      break
    case 'MultiPolygon':
      issues.push(
        ...arrayOf(c, cp, 'MultiPolygon coordinates', (poly, p) =>
          arrayOf(poly, p, 'Polygon coordinates (an array of linear rings)', ringIssues),
        ),
      )
      break
  }
  return issues
}

/** Problems with a Feature object (RFC 7946 §3.2). */
export function featureIssues(f: unknown, path: string): StructureIssue[] {
  if (!isObject(f)) return [{ path, message: `A feature must be an object, got ${describe(f)}` }]
  if (f.type !== 'Feature') {
    return [
      {
        path: join(path, 'type'),
        message:
          f.type === undefined
            ? 'A feature needs "type": "Feature"'
            : `A feature's type must be "Feature", got ${describe(f.type)}`,
      },
    ]
  }
  const issues = forbidden(f, 'Feature', path, 'Feature')
  if ('bbox' in f) issues.push(...bboxIssues(f.bbox, join(path, 'bbox')))
  if ('id' in f && typeof f.id !== 'string' && typeof f.id !== 'number') {
    issues.push({
      path: join(path, 'id'),
      message: `A feature id must be a string or a number, got ${describe(f.id)}`,
    })
  }
  if (!('properties' in f))
    issues.push({
      path: join(path, 'properties'),
      message: 'A feature needs a "properties" member (an object or null)',
    })
  else if (f.properties !== null && !isObject(f.properties)) {
    issues.push({
      path: join(path, 'properties'),
      message: `"properties" must be an object or null, got ${describe(f.properties)}`,
    })
  }
  if (!('geometry' in f))
    issues.push({
      path: join(path, 'geometry'),
      message: 'A feature needs a "geometry" member (an object or null)',
    })
  else if (f.geometry !== null) issues.push(...geometryIssues(f.geometry, join(path, 'geometry')))
  return issues
}

/**
 * Problems with the members of a FeatureCollection other than its features (those are checked
 * one by one as they stream in): `type`, `bbox` and the forbidden members.
 */
export function featureCollectionMemberIssues(
  members: Record<string, unknown>,
  hasFeatures: boolean,
): StructureIssue[] {
  const issues = forbidden(members, 'FeatureCollection', '', 'FeatureCollection')
  if ('bbox' in members) issues.push(...bboxIssues(members.bbox, 'bbox'))
  if (!hasFeatures)
    issues.push({ path: 'features', message: 'A FeatureCollection needs a "features" array' })
  return issues
}

/** At most `max` issues, the rest summed up in one last entry (a broken ring can give hundreds). */
export function capIssues(issues: StructureIssue[], max: number): StructureIssue[] {
  if (issues.length <= max) return issues
  const first = issues[0]!
  return [
    ...issues.slice(0, max),
    { path: first.path, message: `... and ${issues.length - max} more problems of this kind` },
  ]
}

/** Problems with any GeoJSON object: geometry, Feature or FeatureCollection (features included). */
export function geoJsonIssues(value: unknown): StructureIssue[] {
  if (!isObject(value))
    return [{ path: '', message: `A GeoJSON document must be an object, got ${describe(value)}` }]
  if (value.type === 'Feature') return featureIssues(value, '')
  if (value.type === 'FeatureCollection') {
    const { features, ...rest } = value
    const issues = featureCollectionMemberIssues(rest, 'features' in value)
    if ('features' in value)
      issues.push(...arrayOf(features, 'features', '"features"', featureIssues))
    return issues
  }
  if (
    typeof value.type === 'string' &&
    !(GEOMETRY_TYPES as readonly string[]).includes(value.type)
  ) {
    return [
      {
        path: 'type',
        message: `Unknown GeoJSON type "${value.type}" (types are case-sensitive: Feature, FeatureCollection, ${GEOMETRY_TYPES.join(', ')})`,
      },
    ]
  }
  return geometryIssues(value, '')
}
