import { describe, expect, it } from 'vitest'
import { grantPermitSchema } from '../../../shared/schemas/permits.ts'
import { toPermitConditionInputs } from '../../../src/utils/permit-conditions.ts'

describe('toPermitConditionInputs', () => {
  it('drops empty rows, names unnamed ones and fits the grant schema', () => {
    const conditions = toPermitConditionInputs([
      {
        code: 'hand-dig',
        text: 'Dig by hand within 0.5 m.',
        ownerOrganisationId: 4,
        ownerName: 'Water',
      },
      { code: '', text: '  ', ownerOrganisationId: null, ownerName: null },
      { code: '', text: 'Keep the footway open.', ownerOrganisationId: null, ownerName: null },
    ])
    expect(conditions).toEqual([
      { code: 'hand-dig', text: 'Dig by hand within 0.5 m.', ownerOrganisationId: 4 },
      { code: 'office-2', text: 'Keep the footway open.', ownerOrganisationId: null },
    ])
    expect(grantPermitSchema.safeParse({ version: 1, conditions }).success).toBe(true)
  })
})
