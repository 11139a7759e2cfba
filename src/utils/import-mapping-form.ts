import type { ImportMapping, MappableField } from '../../shared/schemas/import-mapping.ts'
import type { ImportPreviewDto } from '../../shared/types/network.ts'
import { segmentFieldLabel, unitOfField } from './segment-fields.ts'

/**
 * The mapping step as plain data: one row per Trenchward field with the source attribute that
 * fills it. The server reads an unmapped field from the attribute of the same name, so a row
 * shows that attribute as its source and only differing names are saved.
 */
export interface MappingRow {
  field: MappableField
  label: string
  unit: string | null
  required: boolean
  /** Source attribute, or null when the file has nothing for this field. */
  source: string | null
  /** How the source was found, to tell the user. */
  origin: 'saved' | 'same-name' | 'similar-name' | 'none'
}

/** Lower case, letters and digits only: "Outer_Diameter (m)" and "outerDiameter_m" agree. */
export function normaliseAttributeName(name: string): string {
  return name.toLowerCase().replace(/[^a-z0-9]/g, '')
}

/** The source attribute for one field: saved mapping, same name, similar name, or none. */
export function sourceForField(
  field: MappableField,
  attributes: readonly string[],
  mapping: ImportMapping,
): Pick<MappingRow, 'source' | 'origin'> {
  const saved = mapping.fields[field]
  if (saved && attributes.includes(saved)) return { source: saved, origin: 'saved' }
  if (attributes.includes(field)) return { source: field, origin: 'same-name' }
  const wanted = normaliseAttributeName(field)
  const similar = attributes.find((a) => normaliseAttributeName(a) === wanted)
  if (similar) return { source: similar, origin: 'similar-name' }
  return { source: null, origin: 'none' }
}

/** The rows of the mapping form for a preview. */
export function mappingRows(preview: ImportPreviewDto): MappingRow[] {
  return preview.targetFields.map((target) => {
    const field = target.field as MappableField
    return {
      field,
      label: segmentFieldLabel(field),
      unit: unitOfField(field),
      required: target.required,
      ...sourceForField(field, preview.sourceAttributes, preview.mapping),
    }
  })
}

/** The mapping to save: the rows' sources (where they differ from the field name) on `base`. */
export function mappingFromRows(rows: readonly MappingRow[], base: ImportMapping): ImportMapping {
  const fields: ImportMapping['fields'] = {}
  for (const row of rows) {
    if (row.source !== null && row.source !== row.field) fields[row.field] = row.source
  }
  return { ...base, fields }
}

/**
 * Required fields the file would leave empty. Medium is covered by a default medium; the
 * owner's own medium also fills it on the server, so it is only a warning there.
 */
export function missingRequiredFields(
  rows: readonly MappingRow[],
  mapping: Pick<ImportMapping, 'defaultMedium'>,
): MappingRow[] {
  return rows.filter(
    (row) =>
      row.required &&
      row.source === null &&
      !(row.field === 'medium' && mapping.defaultMedium !== null),
  )
}

/** The first non-empty value of an attribute in the sample features, as short text. */
export function sampleValue(
  samples: readonly Record<string, unknown>[],
  attribute: string | null,
): string {
  if (!attribute) return ''
  for (const sample of samples) {
    const value = sample[attribute]
    if (value !== null && value !== undefined && value !== '') {
      const text = typeof value === 'object' ? JSON.stringify(value) : String(value)
      return text.length > 40 ? `${text.slice(0, 39)}…` : text
    }
  }
  return ''
}

/**
 * Values of an attribute in the samples that are not among `known` and not yet translated,
 * e.g. a material written "PE" that must be told to mean PE100.
 */
export function untranslatedValues(
  samples: readonly Record<string, unknown>[],
  attribute: string | null,
  known: readonly string[],
  translated: Record<string, string>,
): string[] {
  if (!attribute) return []
  const found = new Set<string>()
  for (const sample of samples) {
    const value = sample[attribute]
    if (typeof value !== 'string' || value.trim() === '') continue
    if (known.includes(value) || value in translated) continue
    found.add(value)
  }
  return [...found]
}
