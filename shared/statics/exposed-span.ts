/**
 * Exposed pipe across an excavation: the pipe as a simply supported beam over the unsupported
 * length, carrying its own weight and its contents (taken full of water).
 */
import { KPA_PER_MPA, UNIT_WEIGHT_WATER_kN_per_m3 } from '../units.ts'
import { requireInRange, requireNonNegative, requirePositive } from './guards.ts'

/** Name of the method, as reported in check results. */
export const EXPOSED_SPAN_METHOD =
  'Simply supported beam under self weight and contents: M = w·L²/8 at the allowable stress, sag 5·w·L⁴/(384·E·I) ≤ L/360'

/**
 * Largest mid-span sag of an exposed pipe as a share of the span (L/360).
 * Source: common practice (the usual serviceability sag limit for beams and pipe supports).
 */
export const EXPOSED_SPAN_SAG_RATIO = 360

function checkWall(outerDiameter_m: number, wallThickness_m: number): void {
  requireInRange('outerDiameter_m', outerDiameter_m, 0, 10, { minExclusive: true })
  requireInRange('wallThickness_m', wallThickness_m, 0, outerDiameter_m / 2, {
    minExclusive: true,
    maxExclusive: true,
  })
}

/**
 * Returns the line load in kN/m of an exposed pipe: wall self weight plus contents, the bore
 * taken full of water (the heavier case for gas and part-full sewers too).
 *
 * @param outerDiameter_m - D, m, (0, 10]
 * @param wallThickness_m - t, m, (0, D/2)
 * @param wallUnitWeight_kN_per_m3 - unit weight of the wall material, kN/m³, (0, 100]
 * @returns w, kN/m
 *
 * Source: common practice (weight of a tube and its water contents).
 */
export function exposedPipeLineLoad_kN_per_m(
  outerDiameter_m: number,
  wallThickness_m: number,
  wallUnitWeight_kN_per_m3: number,
): number {
  checkWall(outerDiameter_m, wallThickness_m)
  requireInRange('wallUnitWeight_kN_per_m3', wallUnitWeight_kN_per_m3, 0, 100, {
    minExclusive: true,
  })
  const inner = outerDiameter_m - 2 * wallThickness_m
  const wallArea = (Math.PI / 4) * (outerDiameter_m * outerDiameter_m - inner * inner)
  const boreArea = (Math.PI / 4) * inner * inner
  return wallArea * wallUnitWeight_kN_per_m3 + boreArea * UNIT_WEIGHT_WATER_kN_per_m3
}

/**
 * Returns the elastic section modulus of a tube, Z = π·(D⁴ − d⁴)/(32·D), in m³.
 *
 * @param outerDiameter_m - D, m, (0, 10]
 * @param wallThickness_m - t, m, (0, D/2)
 *
 * Source: section modulus of a hollow circular section (Roark's Formulas, 7th ed., App. A) [M].
 */
export function tubeSectionModulus_m3(outerDiameter_m: number, wallThickness_m: number): number {
  checkWall(outerDiameter_m, wallThickness_m)
  const inner = outerDiameter_m - 2 * wallThickness_m
  return (Math.PI * (outerDiameter_m ** 4 - inner ** 4)) / (32 * outerDiameter_m)
}

/**
 * Returns the largest bending moment in kN·m of a simply supported span: M = w·L²/8.
 *
 * @param lineLoad_kN_per_m - w, kN/m, >= 0
 * @param span_m - L, m, >= 0
 *
 * Source: simple beam estimate (methods.md 10.3 [M]; example w = 1 kN/m, L = 4 m → 2.0 kN·m [C]).
 */
export function simplySupportedMoment_kNm(lineLoad_kN_per_m: number, span_m: number): number {
  requireNonNegative('lineLoad_kN_per_m', lineLoad_kN_per_m)
  requireNonNegative('span_m', span_m)
  return (lineLoad_kN_per_m * span_m * span_m) / 8
}

/**
 * Returns the longitudinal bending stress in MPa of an exposed span: (w·L²/8)/Z.
 *
 * @param lineLoad_kN_per_m - w, kN/m, >= 0
 * @param span_m - L, m, >= 0
 * @param sectionModulus_m3 - Z, m³, > 0
 *
 * Source: methods.md 10.3 (M = w·L²/8) and elastic beam bending.
 */
export function exposedSpanStress_MPa(
  lineLoad_kN_per_m: number,
  span_m: number,
  sectionModulus_m3: number,
): number {
  requirePositive('sectionModulus_m3', sectionModulus_m3)
  return simplySupportedMoment_kNm(lineLoad_kN_per_m, span_m) / sectionModulus_m3 / KPA_PER_MPA
}

/**
 * Returns the longest simply supported span in m at which the bending stress stays at the
 * allowable value: L = √(8·σ_allow·Z / w).
 *
 * @param allowableStress_MPa - MPa, > 0
 * @param sectionModulus_m3 - Z, m³, > 0
 * @param lineLoad_kN_per_m - w, kN/m, > 0
 *
 * Source: methods.md 10.3 (M = w·L²/8) solved for L.
 */
export function allowableUnsupportedSpan_m(
  allowableStress_MPa: number,
  sectionModulus_m3: number,
  lineLoad_kN_per_m: number,
): number {
  requirePositive('allowableStress_MPa', allowableStress_MPa)
  requirePositive('sectionModulus_m3', sectionModulus_m3)
  requirePositive('lineLoad_kN_per_m', lineLoad_kN_per_m)
  return Math.sqrt((8 * allowableStress_MPa * KPA_PER_MPA * sectionModulus_m3) / lineLoad_kN_per_m)
}

/**
 * Returns the second moment of area of a tube, I = π·(D⁴ − d⁴)/64, in m⁴.
 *
 * @param outerDiameter_m - D, m, (0, 10]
 * @param wallThickness_m - t, m, (0, D/2)
 *
 * Source: second moment of a hollow circular section (Roark's Formulas, 7th ed., App. A) [M].
 */
export function tubeSecondMoment_m4(outerDiameter_m: number, wallThickness_m: number): number {
  checkWall(outerDiameter_m, wallThickness_m)
  const inner = outerDiameter_m - 2 * wallThickness_m
  return (Math.PI * (outerDiameter_m ** 4 - inner ** 4)) / 64
}

/**
 * Returns the longest simply supported span in m whose mid-span sag 5·w·L⁴/(384·E·I) stays at
 * L/ratio: L = ∛(384·E·I / (5·ratio·w)).
 *
 * @param modulus_MPa - E of the pipe wall (short-term for works that last hours or days), MPa, > 0
 * @param secondMoment_m4 - I of the tube, m⁴, > 0
 * @param lineLoad_kN_per_m - w, kN/m, > 0
 * @param sagRatio - allowed sag as L/ratio, dimensionless, >= 1 (default 360)
 *
 * Source: mid-span deflection of a uniformly loaded simple beam (Roark's Formulas, 7th ed., Table 8.1) [M];
 * sag limit common practice.
 */
export function sagLimitedSpan_m(
  modulus_MPa: number,
  secondMoment_m4: number,
  lineLoad_kN_per_m: number,
  sagRatio: number = EXPOSED_SPAN_SAG_RATIO,
): number {
  requirePositive('modulus_MPa', modulus_MPa)
  requirePositive('secondMoment_m4', secondMoment_m4)
  requirePositive('lineLoad_kN_per_m', lineLoad_kN_per_m)
  requireInRange('sagRatio', sagRatio, 1, 1e6)
  return Math.cbrt(
    (384 * modulus_MPa * KPA_PER_MPA * secondMoment_m4) / (5 * sagRatio * lineLoad_kN_per_m),
  )
}
