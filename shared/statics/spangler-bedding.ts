/**
 * Spangler's bedding constant for the Iowa deflection formula, and the published bedding
 * (load) factors for rigid pipes.
 */
import { requireInRange } from './guards.ts'

/**
 * Spangler's bedding constant K by bedding angle 2α in degrees.
 * Source: MOSER, Buried Pipe Design, 3rd ed., Table 3.3 p.87, after Spangler (1941).
 */
export const SPANGLER_BEDDING_CONSTANTS: ReadonlyArray<
  readonly [angle_deg: number, constant: number]
> = [
  [0, 0.11],
  [30, 0.108],
  [45, 0.105],
  [60, 0.102],
  [90, 0.096],
  [120, 0.09],
  [180, 0.083],
]

/**
 * Returns Spangler's bedding constant K (dimensionless) for a bedding angle, linear between the
 * rows of the published table.
 *
 * @param beddingAngle_deg - full bedding (support) angle 2α, degrees, [0, 180]
 * @returns K, dimensionless, [0.083, 0.110]
 *
 * Source: MOSER, Buried Pipe Design, 3rd ed., Table 3.3 p.87 (methods.md 7.1).
 */
export function spanglerBeddingConstant(beddingAngle_deg: number): number {
  requireInRange('beddingAngle_deg', beddingAngle_deg, 0, 180)
  for (let i = 1; i < SPANGLER_BEDDING_CONSTANTS.length; i++) {
    const [a1, k1] = SPANGLER_BEDDING_CONSTANTS[i] as readonly [number, number]
    if (beddingAngle_deg <= a1) {
      const [a0, k0] = SPANGLER_BEDDING_CONSTANTS[i - 1] as readonly [number, number]
      return k0 + ((k1 - k0) * (beddingAngle_deg - a0)) / (a1 - a0)
    }
  }
  return 0.083
}

/**
 * Published bedding factors of the US bedding classes (field strength / TEB strength).
 * Source: MOSER, Buried Pipe Design, 3rd ed., Ex. 3.1 p.82 and Ex. p.250 (methods.md 6.3).
 */
export const US_BEDDING_FACTORS = { B: 1.9, C: 1.5, D: 1.1 } as const
