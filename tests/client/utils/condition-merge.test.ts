import { describe, expect, it } from 'vitest'
import { decidedConditionInputSchema } from '../../../shared/schemas/reviews.ts'
import type { ConditionTemplateDto } from '../../../shared/types/condition-templates.ts'
import {
  addDraft,
  draftFromProposal,
  draftFromTemplate,
  fillTemplateText,
  toDecidedInputs,
} from '../../../src/utils/condition-merge.ts'

const template: ConditionTemplateDto = {
  id: 7,
  code: 'hand-dig',
  title: 'Hand digging near the main',
  text: 'Dig by hand within {distance_m} m of the pipe.',
  parameters: [{ name: 'distance_m', label: 'Distance', unit: 'm', kind: 'number', default: 0.5 }],
  active: true,
  attendanceNotice_h: null,
  photoKinds: [],
  version: 0,
  updatedAt: '2026-12-01T10:00:00Z',
}

describe('condition merge', () => {
  it('fills placeholders and keeps unknown ones', () => {
    expect(fillTemplateText(template.text, { distance_m: 0.8 })).toBe(
      'Dig by hand within 0.8 m of the pipe.',
    )
    expect(fillTemplateText('{x} m', {})).toBe('{x} m')
  })

  it('adds each condition once and builds valid decision inputs', () => {
    let list = addDraft([], draftFromTemplate(template))
    list = addDraft(list, draftFromTemplate(template))
    const proposal = {
      code: 'min-offset',
      text: 'Keep the crane 2.40 m from the pipe.',
      reason: 'The mat load is too high nearer.',
      value_m: 2.4,
      assessmentIds: [3],
    }
    list = addDraft(list, draftFromProposal(proposal))
    expect(list).toHaveLength(2)
    const inputs = toDecidedInputs(list)
    expect(inputs[0]).toEqual({
      source: 'library',
      code: 'hand-dig',
      templateId: 7,
      parameters: { distance_m: 0.5 },
    })
    expect(inputs[1]).toMatchObject({ source: 'engine', text: proposal.text })
    for (const i of inputs) expect(decidedConditionInputSchema.safeParse(i).success).toBe(true)
  })
})
