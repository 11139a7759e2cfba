/**
 * Default properties per pipe material, used only where the pipe owner's stored design data
 * leave a field empty. Each value carries its source; methods.md section 9 says these are
 * plausibility values and that the stored design data come first. Every default the engine
 * applies is listed in the assessment's `assumptions`.
 */
import type { PipeMaterial } from './types.ts'

export interface MaterialDefaults {
  /** Flexible rings (deflection and buckling checks) or rigid rings (crushing, ring bending). */
  behaviour: 'flexible' | 'rigid'
  /** Short-term elastic modulus, or null when no safe default exists (must be given). */
  shortTermModulus_MPa: number | null
  /** Long-term (≈50 year, creep) modulus, or null when no safe default exists. */
  longTermModulus_MPa: number | null
  /** Allowable tensile stress in the wall (hoop, ring bending, span), or null when none. */
  allowableStress_MPa: number | null
  /** Whether a ring-bending stress check is made with the default allowable stress. */
  ringBendingWithDefaultStress: boolean
  /** Long-term deflection limit (flexible pipes), or null for rigid pipes. */
  deflectionLimit_pct: number | null
  /** Unit weight of the wall material, for the self weight of an exposed span. */
  wallUnitWeight_kN_per_m3: number
  /** Whether the pipe is normally socketed or coupled (joints that carry no bending). */
  jointed: boolean
  /** Where each value comes from. */
  source: string
}

/**
 * Defaults per material.
 *
 * Source: methods.md section 9 (moduli and strengths, tags as given there) and 7.2 (deflection
 * limits); wall unit weights are common practice (typical densities of the materials).
 */
export const MATERIAL_DEFAULTS: Readonly<Record<PipeMaterial, Readonly<MaterialDefaults>>> = {
  PE100: {
    behaviour: 'flexible',
    shortTermModulus_MPa: 1000,
    longTermModulus_MPa: 200,
    allowableStress_MPa: 8,
    ringBendingWithDefaultStress: false,
    deflectionLimit_pct: 5,
    wallUnitWeight_kN_per_m3: 9.4,
    jointed: false,
    source:
      'methods.md 9: E 1000 / 200 MPa [S: PE100 manufacturer guidance]; σ_s = MRS/C = 10/1.25 = ' +
      '8 MPa [S]/[M]; deflection limit 5 % (AWWA M55) [M]; unit weight common practice',
  },
  'PVC-U': {
    behaviour: 'flexible',
    shortTermModulus_MPa: 3000,
    longTermModulus_MPa: 1500,
    allowableStress_MPa: 10,
    ringBendingWithDefaultStress: false,
    deflectionLimit_pct: 5,
    wallUnitWeight_kN_per_m3: 13.7,
    jointed: true,
    source:
      'methods.md 9: E 3000–3600 MPa, long-term 1500–1750 MPa (A127), σ_s 10–12.5 MPa [M] ' +
      '(lower ends used); deflection limit 5 % (AWWA C900 practice) [M]; unit weight common practice',
  },
  GRP: {
    behaviour: 'flexible',
    shortTermModulus_MPa: null,
    longTermModulus_MPa: null,
    allowableStress_MPa: null,
    ringBendingWithDefaultStress: false,
    deflectionLimit_pct: 5,
    wallUnitWeight_kN_per_m3: 18.5,
    jointed: true,
    source:
      'methods.md 9: laminate moduli and strain limits are product-specific, so no default; ' +
      'deflection limit 5 % long-term (AWWA M45, C950) [M]; unit weight common practice',
  },
  steel: {
    behaviour: 'flexible',
    shortTermModulus_MPa: 210_000,
    longTermModulus_MPa: 210_000,
    allowableStress_MPa: 117.5,
    ringBendingWithDefaultStress: false,
    deflectionLimit_pct: 2,
    wallUnitWeight_kN_per_m3: 77,
    jointed: false,
    source:
      'methods.md 9: E 210 000 MPa; allowable 50 % of the lowest listed yield, 0.5·235 MPa ' +
      '(AWWA allows 50–75 % of yield) [M]; 7.2: 2 % deflection, mortar-lined and coated (the ' +
      'strictest AWWA M11 case) [M]; unit weight common practice',
  },
  'ductile-iron': {
    behaviour: 'flexible',
    shortTermModulus_MPa: 170_000,
    longTermModulus_MPa: 170_000,
    allowableStress_MPa: 150,
    ringBendingWithDefaultStress: false,
    deflectionLimit_pct: 3,
    wallUnitWeight_kN_per_m3: 70,
    jointed: true,
    source:
      'methods.md 9: E 170 000 MPa, R_p0.2 ≥ 300 MPa [M], allowable taken as 0.5·R_p0.2; ' +
      '7.2: 3 % deflection for cement-lined pipe (DIPRA / AWWA C150) [M]; unit weight common practice',
  },
  concrete: {
    behaviour: 'rigid',
    shortTermModulus_MPa: 30_000,
    longTermModulus_MPa: 30_000,
    allowableStress_MPa: 1.67,
    ringBendingWithDefaultStress: false,
    deflectionLimit_pct: null,
    wallUnitWeight_kN_per_m3: 24,
    jointed: true,
    source:
      'methods.md 9: E ≈ 30 000 MPa (A127) [M]; allowable tensile stress for the exposed-span ' +
      'check 2.5/1.5 MPa (plain-concrete f_ctk,0.05 of C40/50, EN 1992-1-1 Table 3.1) [M], ' +
      'reinforcement ignored; unit weight common practice',
  },
  'vitrified-clay': {
    behaviour: 'rigid',
    shortTermModulus_MPa: 50_000,
    longTermModulus_MPa: 50_000,
    allowableStress_MPa: 6.67,
    ringBendingWithDefaultStress: true,
    deflectionLimit_pct: null,
    wallUnitWeight_kN_per_m3: 22,
    jointed: true,
    source:
      'methods.md 9: E ≈ 50 000 MPa, tensile strength 10–20 MPa, bending tensile 15–40 MPa, ' +
      'γ = 22 kN/m³ [S: clay-pipe manufacturer property sheet]; allowable = lowest tensile ' +
      'strength 10 MPa / 1.5',
  },
}

/**
 * Returns true when the material is treated as a flexible ring (deflection and buckling).
 *
 * Source: issue 3 ("Flexible pipes (PE100, PVC-U, GRP, steel, ductile iron)").
 */
export function isFlexibleMaterial(material: PipeMaterial): boolean {
  return MATERIAL_DEFAULTS[material].behaviour === 'flexible'
}

/**
 * Default deflection lag factor D_L when the stored data give none.
 *
 * Source: methods.md 11 (fallback D_L = 1.5) and 7.1 (Howard used 1.5; 1.0–1.5 range).
 */
export const DEFAULT_DEFLECTION_LAG_FACTOR = 1.5

/**
 * Default bedding factor for rigid pipes: 1.1, the lowest published US class (D), so the
 * default never credits bedding the owner has not recorded.
 *
 * Source: MOSER, Buried Pipe Design, 3rd ed., Ex. 3.1 p.82 (B 1.9, C 1.5, D 1.1), via methods.md 6.3.
 */
export const DEFAULT_BEDDING_FACTOR = 1.1

/**
 * Default safety factor on the three-edge-bearing strength.
 *
 * Source: MOSER, Buried Pipe Design, 3rd ed., Ex. 3.1 p.82 (SF 1.5), via methods.md 6.3.
 */
export const DEFAULT_CRUSHING_SAFETY_FACTOR = 1.5
