import fc from 'fast-check'

/**
 * Generators of bad request bodies for the property-based input tests: wrong types, huge and
 * non-finite numbers, numbers as text ("NaN"), deep nesting, broken and self-intersecting
 * GeoJSON, unusual unicode (including lone surrogates) and huge strings.
 */

const ORIGIN: [number, number] = [9.95, 52.6]
const d = 0.0003
const [x, y] = ORIGIN

/** Polygons that break a rule of RFC 7946 or of our simple-outline rule. */
export const badPolygon = fc.constantFrom<unknown>(
  // Bow-tie: the outline crosses itself.
  {
    type: 'Polygon',
    coordinates: [
      [
        [x, y],
        [x + d, y + d],
        [x + d, y],
        [x, y + d],
        [x, y],
      ],
    ],
  },
  // Figure eight through a repeated corner.
  {
    type: 'Polygon',
    coordinates: [
      [
        [x, y],
        [x + d, y],
        [x, y + d],
        [x + d, y + d],
        [x, y],
      ],
    ],
  },
  // Open ring.
  {
    type: 'Polygon',
    coordinates: [
      [
        [x, y],
        [x + d, y],
        [x + d, y + d],
        [x, y + d],
      ],
    ],
  },
  // Too few corners, all the same point, a hole, latitude beyond the pole.
  {
    type: 'Polygon',
    coordinates: [
      [
        [x, y],
        [x + d, y],
        [x, y],
      ],
    ],
  },
  {
    type: 'Polygon',
    coordinates: [
      [
        [x, y],
        [x, y],
        [x, y],
        [x, y],
      ],
    ],
  },
  {
    type: 'Polygon',
    coordinates: [
      [
        [x, y],
        [x + d, y],
        [x + d, y + d],
        [x, y],
      ],
      [
        [x, y],
        [x + d / 2, y],
        [x, y + d / 2],
        [x, y],
      ],
    ],
  },
  {
    type: 'Polygon',
    coordinates: [
      [
        [x, 95],
        [x + d, 95],
        [x + d, 96],
        [x, 95],
      ],
    ],
  },
  // Coordinates as text, as NaN text, nested one level too deep, missing.
  {
    type: 'Polygon',
    coordinates: [
      [
        ['9.95', '52.6'],
        ['9.96', '52.6'],
        ['9.96', '52.61'],
        ['9.95', '52.6'],
      ],
    ],
  },
  {
    type: 'Polygon',
    coordinates: [
      [
        ['NaN', 'NaN'],
        [1, 2],
        [3, 4],
        ['NaN', 'NaN'],
      ],
    ],
  },
  { type: 'Polygon', coordinates: [[[[x, y]]]] },
  { type: 'Polygon' },
  { type: 'Polygon', coordinates: [] },
  { type: 'MultiPolygon', coordinates: [] },
  { type: 'FeatureCollection', features: [] },
  { type: 'Feature', geometry: null, properties: {} },
  { type: 'GeometryCollection', geometries: [{ type: 'Point', coordinates: [x, y] }] },
  { type: 'Point', coordinates: [1e308, -1e308] },
  { type: 'MultiPoint', coordinates: Array.from({ length: 40 }, () => [x, y]) },
  { type: 'LineString', coordinates: [[x, y]] },
)

/** A polygon with far more corners than any outline may have (and the same point repeated). */
const hugePolygon = fc.integer({ min: 501, max: 800 }).map((n) => ({
  type: 'Polygon',
  coordinates: [
    [
      ...Array.from({ length: n }, (_, i) => [
        x + d * Math.cos((2 * Math.PI * i) / n),
        y + d * Math.sin((2 * Math.PI * i) / n),
      ]),
      [x + d, y],
    ],
  ],
}))

/** Objects or arrays nested 20 to 3,000 levels deep. */
const deepNest = fc
  .tuple(fc.integer({ min: 20, max: 1000 }), fc.boolean())
  .map(([depth, arrays]) => {
    let v: unknown = 1
    for (let i = 0; i < depth; i++) v = arrays ? [v] : { a: v }
    return v
  })

const weirdText = fc.constantFrom(
  'NaN',
  'Infinity',
  '-Infinity',
  '1e309',
  '-0',
  '0x1F',
  '',
  ' ',
  'null',
  'undefined',
  'true',
  '2027-02-30',
  '9999-99-99',
  '2027-1-1',
  '<script>alert(1)</script>',
  "' OR 1=1 --",
  '../../../etc/passwd',
  '\u0000',
  '\ud800',
  '\udfff\ud800',
  '\u202e\u0644\u0627',
  '👷‍♀️🚧'.repeat(50),
  'x'.repeat(70_000),
  '__proto__',
)

const weirdNumber = fc.constantFrom(
  1e308,
  -1e308,
  2 ** 53 + 1,
  -(2 ** 53),
  2 ** 31,
  -(2 ** 31) - 1,
  2 ** 63,
  0,
  -1,
  1.5,
  Number.MIN_VALUE,
  Number.MAX_VALUE,
)

/** One bad value for any field. */
export const badValue: fc.Arbitrary<unknown> = fc.oneof(
  { weight: 3, arbitrary: weirdText },
  { weight: 3, arbitrary: weirdNumber },
  fc.double(),
  fc.integer(),
  fc.boolean(),
  fc.constant(null),
  fc.string({ unit: 'binary', maxLength: 40 }),
  fc.string({ unit: 'grapheme', maxLength: 200 }),
  fc.array(fc.jsonValue({ maxDepth: 1 }), { maxLength: 5 }),
  fc.jsonValue({ maxDepth: 2 }),
  deepNest,
  { weight: 2, arbitrary: badPolygon },
  hugePolygon,
)

type Path = (string | number)[]

/** Every path into a JSON value (objects and arrays), the value itself included. */
function pathsOf(v: unknown, prefix: Path = []): Path[] {
  const out: Path[] = [prefix]
  if (Array.isArray(v)) v.forEach((c, i) => out.push(...pathsOf(c, [...prefix, i])))
  else if (v && typeof v === 'object')
    for (const [k, c] of Object.entries(v)) out.push(...pathsOf(c, [...prefix, k]))
  return out
}

function setAt(v: unknown, path: Path, value: unknown): unknown {
  if (path.length === 0) return value
  const [head, ...rest] = path
  const copy = (Array.isArray(v) ? [...v] : { ...(v as object) }) as Record<
    string | number,
    unknown
  >
  copy[head!] = setAt(copy[head!], rest, value)
  return copy
}

/** A valid body with one field (at any depth) replaced by a bad value, or a bad key added. */
export function mutated(base: unknown): fc.Arbitrary<unknown> {
  const paths = pathsOf(base).filter((p) => p.length > 0)
  const replace = fc
    .tuple(fc.constantFrom(...paths), badValue)
    .map(([p, bad]) => setAt(base, p, bad))
  const twice = fc
    .tuple(fc.constantFrom(...paths), badValue, fc.constantFrom(...paths), badValue)
    .map(([p1, b1, p2, b2]) => setAt(setAt(base, p1, b1), p2, b2))
  return paths.length ? fc.oneof({ weight: 4, arbitrary: replace }, twice) : badValue
}

/** Any JSON body, objects of random keys with bad values, and bad values at the top level. */
export const anyBody: fc.Arbitrary<unknown> = fc.oneof(
  fc.jsonValue({ maxDepth: 4 }),
  fc.dictionary(fc.string({ maxLength: 12 }), badValue, { maxKeys: 6 }),
  badValue,
)

/** Bodies built from a route's field names with bad values in them. */
export function fieldsBody(fields: readonly string[]): fc.Arbitrary<unknown> {
  return fc.dictionary(fc.constantFrom(...fields), badValue, { minKeys: 1, maxKeys: fields.length })
}

/** Text that is not JSON (sent as application/json). */
export const brokenJson = fc.oneof(
  fc.constantFrom('{', '{"a":', '[1,2', '{"a":1}}', "{'a':1}", 'NaN', '{"a":NaN}', '\u0000'),
  fc.string({ maxLength: 50 }).map((s) => `{"${s}`),
)

/** Multipart parts: text fields and at most one file, with a chosen name and content. */
export interface MultipartBody {
  fields: [string, string][]
  file?: { field: string; filename: string; type: string; bytes: Uint8Array }
}

const filename = fc.oneof(
  fc.constantFrom(
    '../../../etc/passwd',
    '..\\..\\windows\\win.ini',
    '/etc/passwd',
    'a\u0000.pdf',
    '.htaccess',
    'CON',
    '',
    'x'.repeat(1000) + '.pdf',
    'pl\u00e4ne \u2013 \u0431.pdf',
    '"; evil="1.pdf',
  ),
  fc.string({ unit: 'grapheme', maxLength: 60 }),
)

export function multipartBody(opts: {
  fieldNames: string[]
  fieldValues?: fc.Arbitrary<string>
  bytes: fc.Arbitrary<Uint8Array>
  filenames?: fc.Arbitrary<string>
}): fc.Arbitrary<MultipartBody> {
  const value = opts.fieldValues ?? fc.oneof(weirdText, fc.string({ maxLength: 40 }))
  return fc.record(
    {
      fields: fc.array(
        fc.tuple(
          fc.oneof(fc.constantFrom(...opts.fieldNames), fc.string({ maxLength: 10 })),
          value,
        ),
        { maxLength: 4 },
      ),
      file: fc.record({
        field: fc.oneof({ weight: 4, arbitrary: fc.constant('file') }, fc.string({ maxLength: 8 })),
        filename: opts.filenames ?? filename,
        type: fc.constantFrom(
          'application/pdf',
          'image/png',
          'text/html',
          'application/octet-stream',
          '',
        ),
        bytes: opts.bytes,
      }),
    },
    { requiredKeys: ['fields'] },
  )
}

/** Bytes that start like none of the accepted file types (PDF, PNG, JPEG, WebP). */
export const notADocument = fc
  .oneof(
    fc.uint8Array({ minLength: 0, maxLength: 3000 }),
    fc.constantFrom(
      new TextEncoder().encode('<html><script>alert(1)</script></html>'),
      new TextEncoder().encode('<svg xmlns="http://www.w3.org/2000/svg" onload="alert(1)"/>'),
      new Uint8Array([0x4d, 0x5a, 0x90, 0x00]),
      new TextEncoder().encode('%PD'),
      new Uint8Array([0xff, 0xd8]),
      new TextEncoder().encode('RIFF\u0000\u0000\u0000\u0000WAVE'),
    ),
  )
  .filter((b) => {
    const head = Buffer.from(b.subarray(0, 12))
    return !(
      head.subarray(0, 5).toString('latin1') === '%PDF-' ||
      (head[0] === 0x89 && head[1] === 0x50) ||
      (head[0] === 0xff && head[1] === 0xd8 && head[2] === 0xff) ||
      head.subarray(0, 4).toString('latin1') === 'RIFF'
    )
  })

/** Multipart text that busboy must refuse or find no file in. */
export const brokenMultipart = fc.oneof(
  fc.constantFrom(
    '--b\r\nContent-Disposition: form-data; name="file"; filename="a.pdf"\r\n\r\n%PDF-1.4',
    '--b\r\n\r\n\r\n--b--',
    '--b--',
    'not multipart at all',
    '--b\r\nContent-Disposition: form-data; name="file"\r\nContent-Type: text/plain\r\n',
  ),
  fc.string({ maxLength: 300 }).map((s) => `--b\r\n${s}\r\n--b--\r\n`),
)
