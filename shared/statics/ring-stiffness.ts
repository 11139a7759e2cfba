/**
 * Section properties and ring stiffness of a pipe wall (solid wall, per metre of pipe).
 */
import { KPA_PER_MPA } from '../units.ts'
import { requireInRange } from './guards.ts'

function checkWall(outerDiameter_m: number, wallThickness_m: number): void {
  requireInRange('outerDiameter_m', outerDiameter_m, 0, 10, { minExclusive: true })
  requireInRange('wallThickness_m', wallThickness_m, 0, outerDiameter_m / 2, {
    minExclusive: true,
    maxExclusive: true,
  })
}

/**
 * Returns the mean radius r = (D − t)/2 in m.
 *
 * @param outerDiameter_m - D, m, (0, 10]
 * @param wallThickness_m - t, m, (0, D/2)
 *
 * Source: issue 3 ("r = (D - t)/2"); methods.md 0.2 (r = mean radius).
 */
export function meanRadius_m(outerDiameter_m: number, wallThickness_m: number): number {
  checkWall(outerDiameter_m, wallThickness_m)
  return (outerDiameter_m - wallThickness_m) / 2
}

/**
 * Returns the second moment of area of the wall per metre of pipe, I = t³/12, in m⁴/m.
 *
 * @param wallThickness_m - t, m, (0, 5]
 *
 * Source: issue 3 ("I = t^3/12 per unit length").
 */
export function wallSecondMoment_m4_per_m(wallThickness_m: number): number {
  requireInRange('wallThickness_m', wallThickness_m, 0, 5, { minExclusive: true })
  return (wallThickness_m * wallThickness_m * wallThickness_m) / 12
}

/**
 * Returns the ring stiffness term E·I/r³ in kPa (the pipe term of the Iowa formula; equal to
 * S_R of A127 and to 8·SN).
 *
 * @param modulus_MPa - wall modulus E, MPa, (0, 300 000]
 * @param outerDiameter_m - D, m, (0, 10]
 * @param wallThickness_m - t, m, (0, D/2)
 * @returns E·I/r³, kPa
 *
 * Source: MOSER, Buried Pipe Design, 3rd ed., p.87 (modified Iowa formula, E·I/r³ term);
 * methods.md 7.3 (S_R = EI/r_m³ = 8·SN).
 */
export function ringStiffness_kPa(
  modulus_MPa: number,
  outerDiameter_m: number,
  wallThickness_m: number,
): number {
  requireInRange('modulus_MPa', modulus_MPa, 0, 300_000, { minExclusive: true })
  const r = meanRadius_m(outerDiameter_m, wallThickness_m)
  return (modulus_MPa * KPA_PER_MPA * wallSecondMoment_m4_per_m(wallThickness_m)) / (r * r * r)
}

/**
 * Returns the ring stiffness SN = E·I/D_m³ in kPa (= kN/m²; ISO 9969 definition).
 *
 * @param modulus_MPa - E, MPa, (0, 300 000]
 * @param outerDiameter_m - D, m, (0, 10]
 * @param wallThickness_m - t, m, (0, D/2)
 * @returns SN, kPa
 *
 * Source: ISO 9969 [M] (methods.md 7.3).
 */
export function ringStiffnessSN_kPa(
  modulus_MPa: number,
  outerDiameter_m: number,
  wallThickness_m: number,
): number {
  return ringStiffness_kPa(modulus_MPa, outerDiameter_m, wallThickness_m) / 8
}

/**
 * Returns the ASTM D2412 pipe stiffness PS = E·I/(0.14878·r³) in kPa from a ring stiffness SN:
 * PS = (8/0.14878)·SN = 53.77·SN.
 *
 * @param ringStiffnessSN_kPa - SN, kPa, [0, 1e6]
 * @returns PS, kPa
 *
 * Source: methods.md 7.3 (PS ↔ SN, [C] from the ring solution of 6.1, Roark Table 9.2).
 */
export function pipeStiffnessFromSN_kPa(ringStiffnessSN_kPa: number): number {
  requireInRange('ringStiffnessSN_kPa', ringStiffnessSN_kPa, 0, 1e6)
  return (8 / (Math.PI / 4 - 2 / Math.PI)) * ringStiffnessSN_kPa
}
