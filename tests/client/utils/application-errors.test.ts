import { describe, expect, it } from 'vitest'
import { mapApplicationFieldIssues } from '../../../src/utils/application-errors.ts'
import { newActivityDraft } from '../../../src/utils/activity-draft.ts'
import {
  buildDraftPayload,
  checkForSubmit,
  emptyWorksFields,
} from '../../../src/utils/application-form.ts'

const square = {
  type: 'Polygon' as const,
  coordinates: [
    [
      [9.95, 52.6],
      [9.9501, 52.6],
      [9.9501, 52.60006],
      [9.95, 52.60006],
      [9.95, 52.6],
    ],
  ],
}

describe('mapApplicationFieldIssues', () => {
  it('puts server paths like activities.0.depth_m onto the activity that was sent at that index', () => {
    const errors = mapApplicationFieldIssues(
      [
        { field: 'startsOn', message: 'Use a date like 2027-03-15' },
        { field: 'activities.0.depth_m', message: 'Depth must be more than 0 m' },
        { field: 'activities.1.geometry.coordinates.0', message: 'The outline crosses itself' },
        { field: 'activities.1.geometry', message: 'second message for the same field' },
        { field: 'activities', message: 'Add at least one activity' },
      ],
      ['key-a', 'key-b'],
    )
    expect(errors.form).toEqual({
      startsOn: 'Use a date like 2027-03-15',
      activities: 'Add at least one activity',
    })
    expect(errors.activities).toEqual({
      'key-a': { depth_m: 'Depth must be more than 0 m' },
      'key-b': { geometry: 'The outline crosses itself' },
    })
  })

  it('reports an index the form no longer has on the activity list instead of losing it', () => {
    const errors = mapApplicationFieldIssues(
      [{ field: 'activities.3.height_m', message: 'Too high' }],
      ['only'],
    )
    expect(errors.form.activities).toBe('Activity 4: Too high')
    expect(errors.activities).toEqual({})
  })
})

describe('buildDraftPayload', () => {
  it('saves complete activities only and remembers which form activity each sent one is', () => {
    const complete = { ...newActivityDraft('excavation'), geometry: square, depth_m: 1.8 }
    const unfinished = newActivityDraft('fill')
    const works = { ...emptyWorksFields(), title: 'Service trench' }
    const build = buildDraftPayload(works, [unfinished, complete])
    expect(build.ok).toBe(true)
    if (!build.ok) return
    expect(build.payload.sentKeys).toEqual([complete.key])
    expect(build.payload.unsavedKeys).toEqual([unfinished.key])
    expect(build.payload.body.activities[0]).toMatchObject({ kind: 'excavation', depth_m: 1.8 })
  })

  it('refuses to save without a title and says so at the title', () => {
    const build = buildDraftPayload(emptyWorksFields(), [])
    expect(build.ok).toBe(false)
    if (build.ok) return
    expect(build.errors.form.title).toBe('Give the works a short title')
  })
})

describe('checkForSubmit', () => {
  it('marks each missing or wrong field of the form and of every activity, with the date rules', () => {
    const a = { ...newActivityDraft('excavation'), geometry: square, depth_m: 45 }
    const b = newActivityDraft('crane')
    const works = {
      ...emptyWorksFields(),
      title: 'Crane lift',
      startsOn: '2030-05-10',
      endsOn: '2030-05-01',
    }
    const errors = checkForSubmit(works, [a, b], new Date('2030-01-01T12:00:00'))
    expect(errors.form.endsOn).toBe('The end date is before the start date')
    expect(errors.form.siteAddress).toBe('Enter where the works are')
    expect(errors.activities[a.key]).toEqual({ depth_m: 'Depths over 30 m need a special study' })
    expect(Object.keys(errors.activities[b.key] ?? {}).sort()).toEqual(['geometry', 'legLoad_kN'])
  })

  it('does not accept a start date in the past', () => {
    const works = { ...emptyWorksFields(), startsOn: '2029-12-31', endsOn: '2030-01-05' }
    expect(checkForSubmit(works, [], new Date('2030-01-01T12:00:00')).form.startsOn).toBe(
      'The start date is in the past',
    )
  })
})
