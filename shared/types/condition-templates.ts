/** One parameter of a library condition, such as a distance or a mat size. */
export interface ConditionParameterDefinition {
  /** Placeholder name used in the text as {name}; carries its unit, e.g. distance_m. */
  name: string
  label: string
  /** Unit shown after the value (m, kPa, days …); empty for plain numbers or words. */
  unit: string
  kind: 'number' | 'text'
  default: number | string | null
  min?: number | undefined
  max?: number | undefined
}

export interface ConditionTemplateDto {
  id: number
  code: string
  title: string
  text: string
  parameters: ConditionParameterDefinition[]
  active: boolean
  /** The owner attends the works and wants the planned start this many hours ahead. */
  attendanceNotice_h: number | null
  /** Photos (reinstatement, trial holes) the crew must upload before recording the finish. */
  photoKinds: ('reinstatement' | 'trial_holes')[]
  version: number
  updatedAt: string
}
