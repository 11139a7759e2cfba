/**
 * Unit conversion constants and tiny converters. Every constant is named X_PER_Y: multiply a
 * value in Y by X_PER_Y to get it in X. The engine computes in SI (m, kN, kPa, MPa, degrees at
 * the edges, radians inside); US values appear only in tests against US-unit sources.
 *
 * Source: ../shared/methods.md section 0.2 (the psi, pcf, lb/ft and kip factors); the others are
 * exact definitions (1 ft = 0.3048 m, 1 in = 0.0254 m by the 1959 international yard).
 */

/** Millimetres per metre (exact). */
export const MM_PER_M = 1000
/** Kilopascals per megapascal (exact). */
export const KPA_PER_MPA = 1000
/** Kilopascals per bar (exact: 1 bar = 100 kPa). */
export const KPA_PER_BAR = 100
/** Metres per international foot (exact). */
export const M_PER_FT = 0.3048
/** Metres per international inch (exact). */
export const M_PER_IN = 0.0254
/** Kilopascals per psi. Source: methods.md 0.2 (1 psi = 6.894757 kPa). */
export const KPA_PER_PSI = 6.894757
/** kN/m³ per pound per cubic foot. Source: methods.md 0.2 (1 pcf = 0.157087 kN/m³). */
export const KN_PER_M3_PER_PCF = 0.157087
/** kN/m per pound per foot of pipe. Source: methods.md 0.2 (1 lb/ft = 0.014594 kN/m). */
export const KN_PER_M_PER_LB_PER_FT = 0.014594
/** Kilonewtons per kip. Source: methods.md 0.2 (1 kip = 4.448222 kN). */
export const KN_PER_KIP = 4.448222
/** Radians per degree (exact). */
export const RAD_PER_DEG = Math.PI / 180
/**
 * Unit weight of water in kN/m³, the value the AWWA buckling demand uses (9.81·h_w).
 * Source: issue 3 (buckling demand `9.81*hw`); methods.md 8.2 (γ_w·h_w).
 */
export const UNIT_WEIGHT_WATER_kN_per_m3 = 9.81

/** Converts an angle in degrees to radians. */
export function degToRad(angle_deg: number): number {
  return angle_deg * RAD_PER_DEG
}

/** Converts a pressure in psi to kPa. */
export function psiToKPa(pressure_psi: number): number {
  return pressure_psi * KPA_PER_PSI
}

/** Converts a pressure in kPa to psi. */
export function kPaToPsi(pressure_kPa: number): number {
  return pressure_kPa / KPA_PER_PSI
}

/** Converts a length in feet to metres. */
export function ftToM(length_ft: number): number {
  return length_ft * M_PER_FT
}

/** Converts a line load in lb/ft to kN/m. */
export function lbPerFtToKNPerM(load_lb_per_ft: number): number {
  return load_lb_per_ft * KN_PER_M_PER_LB_PER_FT
}

/** Converts a line load in kN/m to lb/ft. */
export function kNPerMToLbPerFt(load_kN_per_m: number): number {
  return load_kN_per_m / KN_PER_M_PER_LB_PER_FT
}

/** Converts a unit weight in pcf to kN/m³. */
export function pcfToKNPerM3(unitWeight_pcf: number): number {
  return unitWeight_pcf * KN_PER_M3_PER_PCF
}
