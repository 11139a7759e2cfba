import type { FeatureCollection, LineString } from 'geojson'
import type { ImportMapping } from '../../shared/schemas/import-mapping.ts'
import type { PipeSegmentEdit } from '../../shared/schemas/pipe-segment.ts'
import type {
  ImportFormat,
  ImportPreviewDto,
  ImportReportPage,
  MapLineCollection,
  NetworkImportDto,
  PipeMedium,
  PipeSegmentDto,
  PipeSegmentPage,
} from '../../shared/types/network.ts'
import { config } from '../config.ts'
import { http } from './http.ts'
import { uploadMultipart } from './upload.ts'
import type { UploadHandle } from './upload.ts'

/** Filters, sort and paging of the segment table (GET /api/network/segments). */
export interface SegmentListParams {
  page: number
  pageSize: number
  sort?: string
  order?: 'asc' | 'desc'
  medium?: PipeMedium | null
  material?: string | null
  overCapacity?: boolean | null
  q?: string | null
}

export function fetchSegments(params: SegmentListParams): Promise<PipeSegmentPage> {
  return http.get<PipeSegmentPage>('/network/segments', {
    page: params.page,
    pageSize: params.pageSize,
    sort: params.sort,
    order: params.order,
    medium: params.medium,
    material: params.material,
    overCapacity: params.overCapacity === null ? undefined : params.overCapacity,
    q: params.q?.trim() || undefined,
  })
}

/** How many of the owner's segments are over capacity without any works. */
export async function fetchOverCapacityCount(): Promise<number> {
  const page = await http.get<PipeSegmentPage>('/network/segments', {
    overCapacity: true,
    page: 1,
    pageSize: 1,
  })
  return page.total
}

export function fetchSegment(id: number): Promise<PipeSegmentDto> {
  return http.get<PipeSegmentDto>(`/network/segments/${id}`)
}

export function updateSegment(id: number, edit: PipeSegmentEdit): Promise<PipeSegmentDto> {
  return http.patch<PipeSegmentDto>(`/network/segments/${id}`, edit)
}

/** Properties of a feature in the network export (design data plus these). */
export interface ExportedSegmentProperties {
  segmentId: number
  ownerRef: string
  medium: PipeMedium
  material: string
  length_m: number
  version: number
  baselineVerdict: string | null
  baselineUtilisation: number | null
  baselineOverCapacity: boolean
  [field: string]: unknown
}

export type NetworkCollection = FeatureCollection<LineString, ExportedSegmentProperties>

/** The address of the GeoJSON export, for a download link. */
export function exportUrl(medium?: PipeMedium | null): string {
  const base = `${config.apiBase}/network/export`
  return medium ? `${base}?medium=${encodeURIComponent(medium)}` : base
}

/**
 * The owner's segments in a map view, compact (GET /api/network/map-lines): below zoom
 * MAP_LINES_DETAIL_ZOOM each line is its two end points; `truncated` when the view held more
 * than the server's limit.
 *
 * @param bbox - minLon, minLat, maxLon, maxLat in WGS84 degrees
 */
export function fetchMapLines(
  bbox: readonly [number, number, number, number],
  zoom: number,
  signal?: AbortSignal,
): Promise<MapLineCollection> {
  return http.get<MapLineCollection>(
    '/network/map-lines',
    {
      // Rounded outwards to 6 decimals, so the edges of the view stay inside.
      bbox: bbox.map((v, i) => (i < 2 ? Math.floor(v * 1e6) : Math.ceil(v * 1e6)) / 1e6).join(','),
      zoom: Math.round(zoom * 100) / 100,
    },
    signal,
  )
}

/** How many segments the owner has (the unfiltered table's total). */
export async function fetchSegmentCount(): Promise<number> {
  const page = await http.get<PipeSegmentPage>('/network/segments', { page: 1, pageSize: 1 })
  return page.total
}

export function fetchImportMapping(): Promise<ImportMapping> {
  return http.get<ImportMapping>('/network/mapping')
}

export function saveImportMapping(mapping: ImportMapping): Promise<ImportMapping> {
  return http.put<ImportMapping>('/network/mapping', mapping)
}

export function fetchImport(id: number): Promise<NetworkImportDto> {
  return http.get<NetworkImportDto>(`/network/imports/${id}`)
}

export function fetchImportPreview(id: number): Promise<ImportPreviewDto> {
  return http.get<ImportPreviewDto>(`/network/imports/${id}/preview`)
}

export function startImportValidation(id: number): Promise<NetworkImportDto> {
  return http.post<NetworkImportDto>(`/network/imports/${id}/validate`, {})
}

export function fetchImportReport(
  id: number,
  page: number,
  pageSize: number,
): Promise<ImportReportPage> {
  return http.get<ImportReportPage>(`/network/imports/${id}/report`, { page, pageSize })
}

export function startImportCommit(id: number, skipInvalid: boolean): Promise<NetworkImportDto> {
  return http.post<NetworkImportDto>(`/network/imports/${id}/commit`, { skipInvalid })
}

/** The import format a file name suggests, or null when the server should be told. */
export function formatOfFilename(name: string): ImportFormat | null {
  const lower = name.toLowerCase()
  if (lower.endsWith('.geojson') || lower.endsWith('.json')) return 'geojson'
  if (lower.endsWith('.csv') || lower.endsWith('.txt')) return 'csv'
  return null
}

/**
 * Uploads an import file as multipart (field `file`, and `format` when known), reporting the
 * fraction sent to `onProgress`.
 */
export function uploadImportFile(
  file: File,
  onProgress: (fraction: number) => void,
  format: ImportFormat | null = formatOfFilename(file.name),
): UploadHandle<NetworkImportDto> {
  return uploadMultipart<NetworkImportDto>(
    '/network/imports',
    file,
    format ? { format } : {},
    onProgress,
  )
}
