import type { PermitConditionInput } from '../../shared/schemas/permits.ts'
import type { PermitCondition } from '../../shared/types/permits.ts'

/** A permit condition being edited; `ownerName` is for display only. */
export interface PermitConditionRow {
  code: string
  text: string
  ownerOrganisationId: number | null
  ownerName: string | null
}

export function rowsFromPermitConditions(list: PermitCondition[]): PermitConditionRow[] {
  return list.map((c) => ({ ...c }))
}

/** The rows as the grant and vary schemas want them; empty rows are left out. */
export function toPermitConditionInputs(rows: PermitConditionRow[]): PermitConditionInput[] {
  return rows
    .filter((r) => r.text.trim() !== '')
    .map((r, i) => ({
      code: r.code.trim() || `office-${i + 1}`,
      text: r.text.trim(),
      ownerOrganisationId: r.ownerOrganisationId,
    }))
}
