import type { StructureIssue } from '../../../shared/geo/geojson-structure.ts'

/** A token of stream-json's packed parser (keys, strings and numbers come whole). */
export type JsonToken =
  | { name: 'startObject' | 'endObject' | 'startArray' | 'endArray' }
  | { name: 'keyValue' | 'stringValue' | 'numberValue'; value: string }
  | { name: 'nullValue'; value: null }
  | { name: 'trueValue'; value: true }
  | { name: 'falseValue'; value: false }
  | { name: string; value?: unknown }

interface Frame {
  value: Record<string, unknown> | unknown[]
  keys: Set<string> | null
  key: string | null
  path: string
}

/**
 * Builds one JSON value from parser tokens, like JSON.parse for a single feature, but reports
 * duplicate member names (RFC 8259 says names SHOULD be unique; a duplicate `type` or
 * `geometry` would silently change the meaning) and refuses values with more than `maxValues`
 * scalars, so one huge feature cannot exhaust memory.
 */
export class JsonAssembler {
  private stack: Frame[] = []
  private count = 0
  done = false
  result: unknown = undefined
  readonly issues: StructureIssue[] = []

  constructor(private readonly maxValues: number) {}

  /** Feed one token; returns true when the value is complete. */
  push(token: JsonToken): boolean {
    switch (token.name) {
      case 'startObject':
        this.open({}, new Set())
        return false
      case 'startArray':
        this.open([], null)
        return false
      case 'endObject':
      case 'endArray': {
        const frame = this.stack.pop()!
        return this.add(frame.value)
      }
      case 'keyValue': {
        const top = this.stack[this.stack.length - 1]!
        const key = token.value as string
        if (top.keys!.has(key)) {
          this.issues.push({
            path: top.path ? `${top.path}.${key}` : key,
            message: `The member "${key}" appears more than once`,
          })
        }
        top.keys!.add(key)
        top.key = key
        return false
      }
      case 'stringValue':
        return this.add(token.value)
      case 'numberValue':
        return this.add(Number(token.value))
      case 'nullValue':
        return this.add(null)
      case 'trueValue':
        return this.add(true)
      case 'falseValue':
        return this.add(false)
      default:
        return false
    }
  }

  private childPath(): string {
    const top = this.stack[this.stack.length - 1]
    if (!top) return ''
    const k = Array.isArray(top.value) ? String(top.value.length) : (top.key ?? '')
    return top.path ? `${top.path}.${k}` : k
  }

  private open(value: Record<string, unknown> | unknown[], keys: Set<string> | null): void {
    this.stack.push({ value, keys, key: null, path: this.childPath() })
  }

  private add(value: unknown): boolean {
    if (++this.count > this.maxValues) {
      throw new RangeError(`more than ${this.maxValues.toLocaleString('en')} values in one object`)
    }
    const top = this.stack[this.stack.length - 1]
    if (!top) {
      this.result = value
      this.done = true
      return true
    }
    if (Array.isArray(top.value)) top.value.push(value)
    else top.value[top.key!] = value
    return false
  }
}
