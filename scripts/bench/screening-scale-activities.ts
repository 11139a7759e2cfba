/** The benchmark application's activities at the synthetic city's centre (synthetic-network.ts). */
import { crsTransform } from '../../shared/geo/crs.ts'
import type { ActivityInput } from '../../shared/schemas/application.ts'
import { activityInputSchema } from '../../shared/schemas/application.ts'
import { CITY_CENTRE_LONLAT } from './synthetic-network.ts'

/** The three activities near the city centre's first crossing, in WGS84. */
export function centreActivities(epsg: number): ActivityInput[] {
  const t = crsTransform(epsg)
  const [x0, y0] = t.toGrid(CITY_CENTRE_LONLAT)
  const at = (dx: number, dy: number) => t.toLonLat([x0 + dx, y0 + dy])
  const box = (cx: number, cy: number, w: number, h: number) => ({
    type: 'Polygon' as const,
    coordinates: [[at(cx, cy), at(cx + w, cy), at(cx + w, cy + h), at(cx, cy + h), at(cx, cy)]],
  })
  return [
    {
      kind: 'excavation',
      label: 'Service connection pit',
      geometry: box(30, -4, 2.5, 9),
      depth_m: 1.8,
      support: 'trench-box',
      digging: 'mechanical',
    },
    {
      kind: 'crane',
      label: 'Mobile crane pad',
      setup: 'single-pad',
      geometry: { type: 'Point', coordinates: at(52, 8) },
      legLoad_kN: 650,
      matLength_m: 1.5,
      matWidth_m: 1.5,
      matRotation_deg: 0,
    },
    {
      kind: 'fill',
      label: 'Spoil heap',
      geometry: box(40, 9, 6, 5),
      height_m: 1.5,
      unitWeight_kN_per_m3: 18,
      duration_days: 10,
    },
  ].map((a) => activityInputSchema.parse(a))
}
