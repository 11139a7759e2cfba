import type { PipeSegmentData } from '../../shared/types/network.ts'
import { isPipeMedium, MEDIUM_LABELS } from './pipe-media.ts'

/**
 * How the client names, groups and formats a segment's design data. Units follow the field's
 * name suffix (`_m`, `_kPa`, ...), so label, unit and value never drift apart.
 */
export type SegmentField = keyof PipeSegmentData

export type SegmentFieldKind = 'text' | 'number' | 'choice'

export interface SegmentFieldSpec {
  field: SegmentField
  label: string
  kind: SegmentFieldKind
  /** Display unit, e.g. "m", "kPa", "°"; null for plain numbers and words. */
  unit: string | null
  /** Decimals when shown. */
  decimals: number
  /** A hint under the edit field. */
  hint?: string
}

const UNIT_BY_SUFFIX: [RegExp, string][] = [
  [/_kN_per_m3$/, 'kN/m³'],
  [/_kN_per_m$/, 'kN/m'],
  [/_MPa$/, 'MPa'],
  [/_kPa$/, 'kPa'],
  [/_deg$/, '°'],
  [/_pct$/, '%'],
  [/_m$/, 'm'],
]

/** The display unit of a field, from its name; null when it has none. */
export function unitOfField(field: string): string | null {
  for (const [pattern, unit] of UNIT_BY_SUFFIX) if (pattern.test(field)) return unit
  return null
}

function spec(
  field: SegmentField,
  label: string,
  kind: SegmentFieldKind,
  decimals = 2,
  hint?: string,
): SegmentFieldSpec {
  return { field, label, kind, unit: kind === 'number' ? unitOfField(field) : null, decimals, hint }
}

export interface SegmentFieldGroup {
  key: string
  title: string
  fields: SegmentFieldSpec[]
}

export const SEGMENT_FIELD_GROUPS: SegmentFieldGroup[] = [
  {
    key: 'identity',
    title: 'The segment',
    fields: [
      spec('ownerRef', 'Your reference', 'text'),
      spec('medium', 'Medium', 'choice'),
      spec('material', 'Material', 'choice'),
      spec('yearLaid', 'Year laid', 'number', 0),
    ],
  },
  {
    key: 'section',
    title: 'Pipe and wall',
    fields: [
      spec('outerDiameter_m', 'Outer diameter', 'number', 3),
      spec('wallThickness_m', 'Wall thickness', 'number', 3),
      spec('internalPressure_kPa', 'Internal pressure', 'number', 0),
      spec('shortTermModulus_MPa', 'Short-term modulus', 'number', 0, 'Empty: material default'),
      spec('longTermModulus_MPa', 'Long-term modulus', 'number', 0, 'Empty: material default'),
      spec('allowableStress_MPa', 'Allowable stress', 'number', 1, 'Empty: material default'),
      spec('crushingStrength_kN_per_m', 'Crushing strength', 'number', 1, 'Rigid pipes only'),
      spec('beddingFactor', 'Bedding factor', 'number', 2, 'Rigid pipes only'),
      spec('crushingSafetyFactor', 'Crushing safety factor', 'number', 2, 'Rigid pipes only'),
      spec('deflectionLagFactor', 'Deflection lag factor', 'number', 2, 'Empty: default'),
      spec('deflectionLimit_pct', 'Deflection limit', 'number', 1, 'Empty: material default'),
    ],
  },
  {
    key: 'ground',
    title: 'Laying and ground',
    fields: [
      spec('coverStart_m', 'Cover at start', 'number', 2, 'Ground to crown'),
      spec('coverEnd_m', 'Cover at end', 'number', 2, 'Ground to crown'),
      spec('installation', 'Installation', 'choice'),
      spec('trenchWidth_m', 'Trench width', 'number', 2),
      spec('wallFrictionKMu', 'Trench wall friction Kμ', 'number', 3),
      spec('backfillUnitWeight_kN_per_m3', 'Backfill unit weight', 'number', 1),
      spec('frictionAngle_deg', 'Backfill friction angle', 'number', 0),
      spec('sidefillModulus_MPa', "Sidefill modulus E'", 'number', 1),
      spec('beddingAngle_deg', 'Bedding angle', 'number', 0),
      spec('groundwaterAboveCrown_m', 'Groundwater above crown', 'number', 2),
      spec('designTrafficPressure_kPa', 'Design traffic pressure', 'number', 0),
    ],
  },
  {
    key: 'position',
    title: 'Position',
    fields: [
      spec('positionalAccuracy_m', 'Positional accuracy (±)', 'number', 2),
      spec('positionalQuality', 'How it was captured', 'choice'),
    ],
  },
]

export const SEGMENT_FIELD_SPECS: SegmentFieldSpec[] = SEGMENT_FIELD_GROUPS.flatMap((g) => g.fields)

const SPEC_BY_FIELD = new Map<string, SegmentFieldSpec>(
  SEGMENT_FIELD_SPECS.map((s) => [s.field, s]),
)

export function segmentFieldSpec(field: string): SegmentFieldSpec | undefined {
  return SPEC_BY_FIELD.get(field)
}

/** The plain label of a field, or the raw name for one the client does not know. */
export function segmentFieldLabel(field: string): string {
  return SPEC_BY_FIELD.get(field)?.label ?? field
}

const WORDS: Record<string, string> = {
  trench: 'In a trench',
  embankment: 'Under an embankment',
  surveyed: 'Surveyed',
  digitised: 'Digitised from plans',
  estimated: 'Estimated',
  unknown: 'Unknown',
}

/** A choice value in words (installation, positional quality); others are shown as stored. */
export function choiceWord(value: string): string {
  return WORDS[value] ?? value
}

/** A number with its unit, e.g. "0.018 m"; a dash for empty values. */
export function formatQuantity(
  value: number | null | undefined,
  unit: string | null,
  decimals: number,
): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '—'
  const text = value.toFixed(decimals)
  if (!unit) return text
  return unit === '°' ? `${text}°` : `${text} ${unit}`
}

/** A stored field value as it is shown. */
export function formatFieldValue(field: string, value: unknown): string {
  const s = SPEC_BY_FIELD.get(field)
  if (value === null || value === undefined || value === '') return '—'
  if (typeof value === 'number') {
    if (field === 'yearLaid') return String(value)
    return formatQuantity(value, s?.unit ?? unitOfField(field), s?.decimals ?? 2)
  }
  if (field === 'medium' && isPipeMedium(value)) return MEDIUM_LABELS[value]
  return typeof value === 'string' ? choiceWord(value) : String(value)
}
