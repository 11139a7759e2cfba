import type { CrsTransform } from '../../shared/geo/crs.ts'
import type { ActivityInput } from '../../shared/schemas/application.ts'
import {
  ACTIVITY_KIND_LABELS,
  CRANE_SETUP_LABELS,
  DIGGING_LABELS,
  SUPPORT_LABELS,
  type ActivityGeometry,
} from './activity-draft.ts'
import { describeGeometry } from './geometry-summary.ts'

/** What the check used of one activity, as label/value pairs with units. */
export interface ActivityFacts {
  name: string
  kind: string
  facts: [label: string, value: string][]
}

export function activityFacts(a: ActivityInput, index: number, t: CrsTransform): ActivityFacts {
  const name = a.label?.trim() || `${ACTIVITY_KIND_LABELS[a.kind]} ${index + 1}`
  const where: [string, string] = [
    'On the map',
    describeGeometry(a.geometry as ActivityGeometry, t),
  ]
  if (a.kind === 'excavation') {
    return {
      name,
      kind: ACTIVITY_KIND_LABELS[a.kind],
      facts: [
        where,
        ['Depth', `${a.depth_m.toFixed(2)} m`],
        ['Support', SUPPORT_LABELS[a.support]],
        ['Digging', DIGGING_LABELS[a.digging]],
      ],
    }
  }
  if (a.kind === 'crane') {
    return {
      name,
      kind: ACTIVITY_KIND_LABELS[a.kind],
      facts: [
        where,
        ['Set-up', CRANE_SETUP_LABELS[a.setup]],
        [
          a.setup === 'single-pad' ? 'Pad load' : 'Largest leg load',
          `${a.legLoad_kN.toFixed(0)} kN`,
        ],
        [
          'Mat',
          `${a.matLength_m.toFixed(2)} m × ${a.matWidth_m.toFixed(2)} m, turned ${a.matRotation_deg.toFixed(0)}°`,
        ],
      ],
    }
  }
  return {
    name,
    kind: ACTIVITY_KIND_LABELS[a.kind],
    facts: [
      where,
      ['Height', `${a.height_m.toFixed(2)} m`],
      ['Unit weight', `${a.unitWeight_kN_per_m3.toFixed(1)} kN/m³`],
      ['In place for', `${a.duration_days} day${a.duration_days === 1 ? '' : 's'}`],
    ],
  }
}
