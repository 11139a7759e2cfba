import type { FeatureCollection, Geometry } from 'geojson'
import type { MapLayerSpec } from '../components/map/map-layer.ts'
import type { ActivityFeatureCollection } from '../../shared/types/reviews.ts'
import { isPipeMedium } from './pipe-media.ts'

interface SegmentLine {
  assessmentId: number
  medium: string
  verdict: string
  geometry: { type: 'LineString'; coordinates: [number, number][] }
}

/** Map layers of a review or decision: the works and the affected pipes. */
export function reviewMapLayers(
  activities: ActivityFeatureCollection,
  segments: SegmentLine[],
  pipesTitle = 'Affected pipes',
): MapLayerSpec[] {
  const pipes: FeatureCollection<Geometry> = {
    type: 'FeatureCollection',
    features: segments.map((s) => ({
      type: 'Feature',
      id: s.assessmentId,
      properties: { medium: isPipeMedium(s.medium) ? s.medium : 'other', verdict: s.verdict },
      geometry: s.geometry,
    })),
  }
  const works = {
    type: 'FeatureCollection',
    features: activities.features.map((f) => ({
      type: 'Feature',
      id: f.id,
      properties: { ...f.properties },
      geometry: f.geometry as Geometry,
    })),
  } as FeatureCollection<Geometry>
  return [
    { id: 'affected-pipes', kind: 'pipes', title: pipesTitle, data: pipes },
    { id: 'works', kind: 'works', title: 'Planned works', data: works },
  ]
}
