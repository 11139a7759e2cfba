import type {
  ConditionTemplateInput,
  ConditionTemplateUpdate,
} from '../../shared/schemas/condition-templates.ts'
import type { ConditionTemplateDto } from '../../shared/types/condition-templates.ts'
import { http } from './http.ts'

export function fetchConditionTemplates(includeInactive = true): Promise<ConditionTemplateDto[]> {
  return http.get<ConditionTemplateDto[]>('/condition-templates', { includeInactive })
}

export function createConditionTemplate(
  input: ConditionTemplateInput,
): Promise<ConditionTemplateDto> {
  return http.post<ConditionTemplateDto>('/condition-templates', input)
}

/** 409 CONFLICT when someone saved a newer version meanwhile. */
export function updateConditionTemplate(
  id: number,
  update: ConditionTemplateUpdate,
): Promise<ConditionTemplateDto> {
  return http.put<ConditionTemplateDto>(`/condition-templates/${id}`, update)
}

/** Retires the condition; decisions that used it keep it. */
export function retireConditionTemplate(id: number): Promise<void> {
  return http.delete<void>(`/condition-templates/${id}`)
}
