import type { ActivityGeometry } from '../../utils/activity-draft.ts'

/** What the works map needs of each activity. */
export interface DrawableActivity {
  key: string
  name: string
  geometry: ActivityGeometry | null
}

/** An ongoing drawing on the works map. */
export interface DrawRequest {
  key: string
  /** 'Polygon': one outline, finished by a double-click; 'Point': one point per click. */
  type: 'Polygon' | 'Point'
  /** Shown over the map while drawing. */
  hint: string
}
