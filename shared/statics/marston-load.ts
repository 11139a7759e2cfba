/**
 * Marston's trench load per metre of pipe and the related prism and embankment loads. The engine
 * uses these for rigid pipes, which attract the load of the whole trench width (methods.md 2.1).
 */
import { requireInRange, requirePositive } from './guards.ts'
import { siloFactor } from './silo-factor.ts'

/**
 * Returns Marston's trench load coefficient C_d (dimensionless).
 *
 * C_d = (1 − exp(−2·Kμ'·H/B_d)) / (2·Kμ') = κ·H/B_d; C_d → H/B_d when Kμ' → 0 (prism).
 *
 * @param wallFrictionKMu - K·μ', dimensionless, [0, 1]
 * @param cover_m - fill height above the crown H, m, (0, 100]
 * @param trenchWidth_m - trench width at the crown B_d, m, (0, 100]
 * @returns C_d, dimensionless
 *
 * Source: UFC 3-220-10 Eq. 4-6/4-7 [S2]; ACPA Concrete Pipe Design Manual App. B Eq. B1/B2;
 * MOSER, Buried Pipe Design, 3rd ed., Fig. 2.1 p.12 (methods.md 2.1).
 */
export function marstonTrenchLoadCoefficient(
  wallFrictionKMu: number,
  cover_m: number,
  trenchWidth_m: number,
): number {
  return (siloFactor(wallFrictionKMu, cover_m, trenchWidth_m) * cover_m) / trenchWidth_m
}

/**
 * Returns the Marston trench load on a rigid pipe in kN/m: W_d = C_d·γ·B_d².
 *
 * @param loadCoefficient - C_d, dimensionless, [0, 1000]
 * @param unitWeight_kN_per_m3 - backfill unit weight γ, kN/m³, (0, 30]
 * @param trenchWidth_m - trench width at the crown B_d, m, (0, 100]
 * @returns load per metre of pipe, kN/m
 *
 * Source: UFC 3-220-10 Eq. 4-6 [S2]; MOSER, Buried Pipe Design, 3rd ed., Ex. 3.2 p.82 (methods.md 2.1).
 */
export function marstonRigidTrenchLoad_kN_per_m(
  loadCoefficient: number,
  unitWeight_kN_per_m3: number,
  trenchWidth_m: number,
): number {
  requireInRange('loadCoefficient', loadCoefficient, 0, 1000)
  requireInRange('unitWeight_kN_per_m3', unitWeight_kN_per_m3, 0, 30, { minExclusive: true })
  requireInRange('trenchWidth_m', trenchWidth_m, 0, 100, { minExclusive: true })
  return loadCoefficient * unitWeight_kN_per_m3 * trenchWidth_m * trenchWidth_m
}

/**
 * Returns the Marston trench load on a flexible pipe with well-compacted sidefill in kN/m:
 * W_c = C_d·γ·B_d·B_c.
 *
 * @param loadCoefficient - C_d, dimensionless, [0, 1000]
 * @param unitWeight_kN_per_m3 - γ, kN/m³, (0, 30]
 * @param trenchWidth_m - B_d, m, (0, 100]
 * @param outerDiameter_m - B_c, m, (0, 10]
 * @returns load per metre of pipe, kN/m
 *
 * Source: UFC 3-220-10 Eq. 4-8 [S2] (methods.md 2.1).
 */
export function marstonFlexibleTrenchLoad_kN_per_m(
  loadCoefficient: number,
  unitWeight_kN_per_m3: number,
  trenchWidth_m: number,
  outerDiameter_m: number,
): number {
  requireInRange('outerDiameter_m', outerDiameter_m, 0, 10, { minExclusive: true })
  return (
    (marstonRigidTrenchLoad_kN_per_m(loadCoefficient, unitWeight_kN_per_m3, trenchWidth_m) *
      outerDiameter_m) /
    trenchWidth_m
  )
}

/**
 * Returns the prism load in kN/m: W_p = γ·H·B_c (the soil column directly above the pipe).
 *
 * @param unitWeight_kN_per_m3 - γ, kN/m³, (0, 30]
 * @param cover_m - H, m, (0, 100]
 * @param outerDiameter_m - B_c, m, (0, 10]
 * @returns load per metre of pipe, kN/m
 *
 * Source: UFC 3-220-10 Eq. 4-9 [S2] (methods.md 2.1).
 */
export function prismLoad_kN_per_m(
  unitWeight_kN_per_m3: number,
  cover_m: number,
  outerDiameter_m: number,
): number {
  requireInRange('unitWeight_kN_per_m3', unitWeight_kN_per_m3, 0, 30, { minExclusive: true })
  requireInRange('cover_m', cover_m, 0, 100, { minExclusive: true })
  requireInRange('outerDiameter_m', outerDiameter_m, 0, 10, { minExclusive: true })
  return unitWeight_kN_per_m3 * cover_m * outerDiameter_m
}

/**
 * Upper bound of the AASHTO soil–structure interaction factor F_e for embankments with compacted
 * sidefill. Source: AASHTO LRFD Eq. 12.11.2.2.1-2 as quoted by a state DOT culvert manual [S2]
 * (methods.md 2.3, check 2.7).
 */
export const EMBANKMENT_INTERACTION_FACTOR_MAX = 1.15

/**
 * Returns the AASHTO soil–structure interaction factor F_e = 1 + 0.20·H/B_c ≤ 1.15
 * (dimensionless) for a rigid pipe under an embankment with compacted sidefill.
 *
 * @param cover_m - H, m, (0, 100]
 * @param outerDiameter_m - B_c, m, (0, 10]
 * @returns F_e, dimensionless, [1, 1.15]
 *
 * Source: AASHTO LRFD Eq. 12.11.2.2.1-2 [S2] (methods.md 2.3).
 */
export function embankmentInteractionFactor(cover_m: number, outerDiameter_m: number): number {
  requireInRange('cover_m', cover_m, 0, 100, { minExclusive: true })
  requirePositive('outerDiameter_m', outerDiameter_m)
  return Math.min(1 + (0.2 * cover_m) / outerDiameter_m, EMBANKMENT_INTERACTION_FACTOR_MAX)
}

/**
 * Returns the soil load on a rigid pipe in kN/m: the Marston trench load C_d·γ·B_d², but never
 * more than the embankment load F_e·γ·H·B_c (beyond the transition width the embankment load
 * governs and stays constant), and never less than κ·γ·H·B_c.
 *
 * @param siloFactorValue - κ for this state (1 when wall friction is not counted), (0, 1]
 * @param unitWeight_kN_per_m3 - γ, kN/m³, (0, 30]
 * @param cover_m - H, m, (0, 100]
 * @param trenchWidth_m - B_d, m (for an embankment pass Infinity), ≥ B_c
 * @param outerDiameter_m - B_c, m, (0, 10]
 * @returns load per metre of pipe, kN/m
 *
 * Source: Marston trench load (methods.md 2.1, UFC Eq. 4-6 [S2]); transition width rule
 * W = min(W_trench, W_embankment) (MOSER p.20 [S], ACPA Design Data 7); F_e (AASHTO [S2]).
 */
export function rigidPipeSoilLoad_kN_per_m(
  siloFactorValue: number,
  unitWeight_kN_per_m3: number,
  cover_m: number,
  trenchWidth_m: number,
  outerDiameter_m: number,
): number {
  requireInRange('siloFactor', siloFactorValue, 0, 1, { minExclusive: true })
  requireInRange('unitWeight_kN_per_m3', unitWeight_kN_per_m3, 0, 30, { minExclusive: true })
  requireInRange('cover_m', cover_m, 0, 100, { minExclusive: true })
  requireInRange('outerDiameter_m', outerDiameter_m, 0, 10, { minExclusive: true })
  if (Number.isNaN(trenchWidth_m) || trenchWidth_m < outerDiameter_m) {
    throw new RangeError(`trenchWidth_m must be >= outerDiameter_m (got ${trenchWidth_m})`)
  }
  const prismPressure_kPa = unitWeight_kN_per_m3 * cover_m
  const embankment =
    embankmentInteractionFactor(cover_m, outerDiameter_m) * prismPressure_kPa * outerDiameter_m
  const trench = siloFactorValue * prismPressure_kPa * trenchWidth_m
  const floor = siloFactorValue * prismPressure_kPa * outerDiameter_m
  return Math.max(Math.min(trench, embankment), floor)
}
