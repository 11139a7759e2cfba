import type { OutlineCollection } from '../../shared/types/network.ts'
import { http } from './http.ts'

/** [minLon, minLat, maxLon, maxLat] in WGS84. */
export type LonLatBox = [number, number, number, number]

/**
 * The public screening outline inside a box: where pipes lie, whose they are and what they carry.
 * No design data; `truncated` when the box held more pipes than the server returns.
 */
export function fetchOutline(bbox: LonLatBox, signal?: AbortSignal): Promise<OutlineCollection> {
  return http.get<OutlineCollection>('/network/outline', { bbox: bbox.join(',') }, signal)
}
