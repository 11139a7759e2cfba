import type { PipeMedium } from '../../../shared/types/network.ts'

/** The filter set of the segment table. */
export interface SegmentFilterValues {
  medium: PipeMedium | null
  material: string | null
  overCapacity: boolean | null
  q: string | null
}
