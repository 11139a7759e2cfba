import {
  NUMERIC_SEGMENT_FIELDS,
  pipeSegmentDataSchema,
  pipeSegmentEditSchema,
  type PipeSegmentEdit,
} from '../../shared/schemas/pipe-segment.ts'
import type { PipeSegmentData } from '../../shared/types/network.ts'
import { fieldErrorsFromZod, type FieldErrors } from './field-errors.ts'
import { SEGMENT_FIELD_SPECS, type SegmentField } from './segment-fields.ts'

/**
 * The segment edit form as plain data: what the inputs hold, and how that becomes the PATCH
 * body. Checked with the same shared schema as an import (the merged segment), so the user sees
 * at the field what the server would refuse.
 */
export type SegmentFormValue = string | number | null
export type SegmentForm = Record<SegmentField, SegmentFormValue>

const NUMERIC = new Set<string>(NUMERIC_SEGMENT_FIELDS)

/** The form's starting values: the stored data as they are. */
export function formFromSegment(data: PipeSegmentData): SegmentForm {
  const form = {} as SegmentForm
  for (const { field } of SEGMENT_FIELD_SPECS) form[field] = data[field]
  return form
}

/**
 * A form value as the schema expects it: numbers from number inputs or text ("0,4" and "0.4"
 * both read as 0.4), empty numeric inputs as null; text trimmed.
 */
export function normaliseFormValue(field: SegmentField, raw: SegmentFormValue): SegmentFormValue {
  if (NUMERIC.has(field)) {
    if (raw === null || raw === '') return null
    if (typeof raw === 'number') return raw
    const text = raw.trim().replace(',', '.')
    if (text === '') return null
    const n = Number(text)
    return Number.isFinite(n) ? n : raw
  }
  return typeof raw === 'string' ? raw.trim() : raw
}

export type SegmentEditResult =
  { ok: true; edit: PipeSegmentEdit; changed: SegmentField[] } | { ok: false; errors: FieldErrors }

/**
 * The PATCH body for the fields that differ from the stored data, with the version last read.
 * Fails with field errors when the merged segment would break a rule.
 */
export function buildSegmentEdit(
  original: PipeSegmentData,
  form: SegmentForm,
  version: number,
): SegmentEditResult {
  const merged: Record<string, unknown> = { ...original }
  const changes: Record<string, unknown> = {}
  const changed: SegmentField[] = []
  for (const { field } of SEGMENT_FIELD_SPECS) {
    const value = normaliseFormValue(field, form[field])
    merged[field] = value
    if (value !== original[field]) {
      changes[field] = value
      changed.push(field)
    }
  }
  const full = pipeSegmentDataSchema.safeParse(merged)
  if (!full.success) return { ok: false, errors: fieldErrorsFromZod(full.error) }
  const edit = pipeSegmentEditSchema.safeParse({ ...changes, version })
  if (!edit.success) return { ok: false, errors: fieldErrorsFromZod(edit.error) }
  return { ok: true, edit: edit.data, changed }
}
