import { createReadStream } from 'node:fs'
import { StringDecoder } from 'node:string_decoder'
import { jsonParser } from 'stream-json/core/parser.js'
import type { FieldIssue } from '../../../shared/errors.ts'
import {
  capIssues,
  featureCollectionMemberIssues,
  featureIssues,
  geoJsonIssues,
} from '../../../shared/geo/geojson-structure.ts'
import { JsonAssembler } from './json-assembler.ts'
import type { JsonToken } from './json-assembler.ts'
import { FileLevelError } from './source-feature.ts'
import type { SourceFeature, SourceReader } from './source-feature.ts'

/** Most scalar values one feature (or one other top-level member) may hold. */
export const MAX_VALUES_PER_FEATURE = 1_000_000
/** Structural problems reported per feature before the rest are summed up. */
export const MAX_ISSUES_PER_FEATURE = 5

// stream-chain's markers (Symbol.for, so no import of that transitive package is needed).
const NONE = Symbol.for('object-stream.none')
const tokensOf = (r: unknown): JsonToken[] =>
  r && typeof r === 'object' && Array.isArray((r as { values?: unknown }).values)
    ? (r as { values: JsonToken[] }).values
    : []

const describeTop = (t: JsonToken) =>
  t.name === 'startArray'
    ? 'an array'
    : t.name === 'nullValue'
      ? 'null'
      : t.name === 'stringValue'
        ? 'a string'
        : 'a single value'

/**
 * Streams a GeoJSON FeatureCollection from a file: the `features` array is handed on one feature
 * at a time (each assembled alone, checked against RFC 7946), the other top-level members are
 * kept and checked at the end. Memory stays at one feature plus the parser's buffer, whatever
 * the file size. Key order is free, so `type` may come after `features`: the caller learns of a
 * wrong top-level type from `fileIssues()` after the last feature.
 */
export function geoJsonReader(path: string): SourceReader {
  const fileIssues: FieldIssue[] = []
  const attributes = new Set<string>()

  async function* features(): AsyncGenerator<SourceFeature> {
    const parse = jsonParser({ packValues: true, streamValues: false })
    const decoder = new StringDecoder('utf8')
    const members: Record<string, unknown> = {}
    const memberKeys = new Set<string>()
    let depth = 0
    let started = false
    let topIsObject = false
    let first = true
    let key: string | null = null
    let inFeatures = false
    let sawFeatures = false
    let index = 0
    let assembler: JsonAssembler | null = null
    let assembling: 'feature' | 'member' | 'top' | null = null
    const out: SourceFeature[] = []

    const handle = (t: JsonToken) => {
      if (assembler) {
        let complete: boolean
        try {
          complete = assembler.push(t)
        } catch (err) {
          const where = assembling === 'feature' ? `features.${index}` : (key ?? 'file')
          throw new FileLevelError([
            { field: where, message: `Too large: ${(err as Error).message}` },
          ])
        }
        if (!complete) return
        const value = assembler.result
        const dupes = assembler.issues
        if (assembling === 'feature') {
          const f = value as Record<string, unknown> | null
          const issues = capIssues([...dupes, ...featureIssues(value, '')], MAX_ISSUES_PER_FEATURE)
          const props =
            f &&
            typeof f === 'object' &&
            !Array.isArray(f) &&
            f.properties &&
            typeof f.properties === 'object' &&
            !Array.isArray(f.properties)
              ? (f.properties as Record<string, unknown>)
              : null
          if (props) for (const k of Object.keys(props)) attributes.add(k)
          const id =
            f && typeof f === 'object' && (typeof f.id === 'string' || typeof f.id === 'number')
              ? f.id
              : null
          out.push({
            index,
            id,
            properties: props,
            geometry: f && typeof f === 'object' ? f.geometry : undefined,
            structureIssues: issues,
          })
          index++
        } else if (assembling === 'member') {
          members[key!] = value
          for (const d of dupes) fileIssues.push({ field: `${key}.${d.path}`, message: d.message })
        } else {
          // The whole document is one scalar or array: not GeoJSON at all.
          fileIssues.push({
            field: 'file',
            message: `A GeoJSON file must hold one object, but it holds ${Array.isArray(value) ? 'an array' : value === null ? 'null' : `a ${typeof value}`}`,
          })
        }
        assembler = null
        assembling = null
        return
      }
      if (!started) {
        started = true
        if (t.name !== 'startObject') {
          assembler = new JsonAssembler(MAX_VALUES_PER_FEATURE)
          assembling = 'top'
          if (t.name === 'startArray') {
            handle(t)
          } else {
            fileIssues.push({
              field: 'file',
              message: `A GeoJSON file must hold one object, but it holds ${describeTop(t)}`,
            })
            assembler = null
            assembling = null
          }
          return
        }
        depth = 1
        topIsObject = true
        return
      }
      if (inFeatures) {
        if (t.name === 'endArray') {
          inFeatures = false
          return
        }
        assembler = new JsonAssembler(MAX_VALUES_PER_FEATURE)
        assembling = 'feature'
        handle(t)
        return
      }
      if (depth === 1) {
        if (t.name === 'keyValue') {
          key = t.value as string
          if (memberKeys.has(key))
            fileIssues.push({ field: key, message: `The member "${key}" appears more than once` })
          memberKeys.add(key)
          return
        }
        if (t.name === 'endObject') {
          depth = 0
          return
        }
        if (key === 'features' && t.name === 'startArray') {
          inFeatures = true
          sawFeatures = true
          return
        }
        assembler = new JsonAssembler(MAX_VALUES_PER_FEATURE)
        assembling = 'member'
        handle(t)
      }
    }

    const feed = (text: string | typeof NONE) => {
      let tokens: JsonToken[]
      try {
        tokens = tokensOf(parse(text as string))
      } catch (err) {
        const m = (err as Error).message.replace(/^Parser cannot parse input: /, '')
        const where = index > 0 ? ` after feature ${index - 1}` : ''
        throw new FileLevelError([
          { field: 'file', message: `The file is not valid JSON${where}: ${m}` },
        ])
      }
      for (const t of tokens) handle(t)
    }

    for await (const chunk of createReadStream(path, { highWaterMark: 1 << 20 })) {
      let text = decoder.write(chunk as Buffer)
      if (first && text.length) {
        if (text.charCodeAt(0) === 0xfeff) text = text.slice(1)
        first = false
      }
      feed(text)
      if (out.length) yield* out.splice(0)
    }
    const rest = decoder.end()
    if (rest) feed(rest)
    if (!started) throw new FileLevelError([{ field: 'file', message: 'The file is empty' }])
    feed(NONE)
    if (out.length) yield* out.splice(0)

    if (topIsObject && depth === 0) {
      const type = members.type
      if (type !== 'FeatureCollection') {
        if (sawFeatures) {
          fileIssues.push({
            field: 'type',
            message:
              type === undefined
                ? 'The file needs "type": "FeatureCollection"'
                : `The file's type must be "FeatureCollection" (case-sensitive), got ${JSON.stringify(type)}`,
          })
        } else {
          // A geometry, a Feature or something else: name its own RFC 7946 problems first.
          for (const i of capIssues(geoJsonIssues(members), MAX_ISSUES_PER_FEATURE))
            fileIssues.push({ field: i.path || 'file', message: i.message })
          fileIssues.push({
            field: 'type',
            message:
              typeof type === 'string'
                ? `An import file must be a FeatureCollection of LineString features; this file is a single ${type}`
                : 'An import file must be a FeatureCollection of LineString features',
          })
        }
      } else {
        for (const i of featureCollectionMemberIssues(members, sawFeatures))
          fileIssues.push({ field: i.path, message: i.message })
        if (memberKeys.has('features') && !sawFeatures) {
          fileIssues.splice(
            fileIssues.findIndex((i) => i.field === 'features'),
            1,
            {
              field: 'features',
              message: `"features" must be an array, got ${members.features === null ? 'null' : typeof members.features === 'object' ? 'an object' : `a ${typeof members.features}`}`,
            },
          )
        }
      }
    }
  }

  return {
    features,
    fileIssues: () => fileIssues,
    attributeNames: () => [...attributes],
  }
}
