/**
 * Silo (trench-wall friction) reduction of the soil load on a pipe in a trench: the
 * Janssen/Marston solution written as a factor on the prism pressure γ·H.
 */
import { requireInRange, requirePositive } from './guards.ts'

/** Below this value of 2·Kμ'·H/B the closed form loses digits; a Taylor series is used. */
const SERIES_THRESHOLD = 1e-6

/**
 * Returns the silo factor κ (dimensionless, 0 < κ ≤ 1): the ratio of the vertical soil
 * pressure at the crown in a trench to the prism pressure γ·H.
 *
 * κ = (1 − exp(−2·Kμ'·H/B)) / (2·Kμ'·H/B); κ → 1 as Kμ'·H/B → 0.
 *
 * @param wallFrictionKMu - K·μ' of the backfill against the trench wall, dimensionless, [0, 1]
 *   (classic Marston maxima 0.110–0.1924)
 * @param cover_m - backfill height above the crown H, m, (0, 100]
 * @param trenchWidth_m - trench width at the crown B, m, (0, 100]
 * @returns κ, dimensionless
 *
 * Source: Marston/Janssen, as in ACPA Concrete Pipe Design Manual App. B Eq. B1/B2 and UFC 3-220-10
 * Eq. 4-6/4-7 (methods.md 2.1: C_d = κ·H/B); German form A127 (methods.md 2.2) with K1·tanδ = Kμ'.
 */
export function siloFactor(
  wallFrictionKMu: number,
  cover_m: number,
  trenchWidth_m: number,
): number {
  requireInRange('wallFrictionKMu', wallFrictionKMu, 0, 1)
  requireInRange('cover_m', cover_m, 0, 100, { minExclusive: true })
  requireInRange('trenchWidth_m', trenchWidth_m, 0, 100, { minExclusive: true })
  const x = (2 * wallFrictionKMu * cover_m) / trenchWidth_m
  if (x < SERIES_THRESHOLD) return 1 - x / 2 + (x * x) / 6
  return -Math.expm1(-x) / x
}

/**
 * Returns true when a trench counts as an embankment for the soil load (κ = 1): a trench at least
 * four outside diameters wide.
 *
 * @param trenchWidth_m - trench width at the crown, m, > 0
 * @param outerDiameter_m - pipe outside diameter, m, > 0
 *
 * Source: issue 3 ("a trench at least 4 outside diameters wide: kappa = 1"); A127 treats b ≥ 4·d_a
 * as an embankment (methods.md 2.3, [M]).
 */
export function trenchActsAsEmbankment(trenchWidth_m: number, outerDiameter_m: number): boolean {
  requirePositive('trenchWidth_m', trenchWidth_m)
  requirePositive('outerDiameter_m', outerDiameter_m)
  return trenchWidth_m >= 4 * outerDiameter_m
}

/**
 * Returns the vertical soil pressure at the crown in kPa: κ·γ·H.
 *
 * @param siloFactorValue - κ, dimensionless, (0, 1]
 * @param unitWeight_kN_per_m3 - backfill unit weight γ, kN/m³, (0, 30]
 * @param cover_m - cover H, m, (0, 100]
 * @returns pressure, kPa
 *
 * Source: issue 3 ("Soil pressure at crown = kappa * unit weight * cover"); methods.md 2.2 (p_E = κ·γ·h).
 */
export function soilPressureAtCrown_kPa(
  siloFactorValue: number,
  unitWeight_kN_per_m3: number,
  cover_m: number,
): number {
  requireInRange('siloFactor', siloFactorValue, 0, 1, { minExclusive: true })
  requireInRange('unitWeight_kN_per_m3', unitWeight_kN_per_m3, 0, 30, { minExclusive: true })
  requireInRange('cover_m', cover_m, 0, 100, { minExclusive: true })
  return siloFactorValue * unitWeight_kN_per_m3 * cover_m
}
