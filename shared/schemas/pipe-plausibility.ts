import type { PipeMaterial } from '../statics/types.ts'

/**
 * Plausible design data per material: a value outside these bounds is almost surely a unit
 * slip (mm for m, bar for kPa) or a wrong material, so an import names it rather than storing
 * it. The engine's own limits (PIPE_FIELD_RANGES) are wider and material-blind; these are
 * checked in addition. Bounds are deliberately generous: they enclose every size and class of
 * the product standards named, so a real pipe is never refused.
 *
 * Sources (dimension series): PE100 EN 12201-2 (d 16–2500 mm, SDR 6–41); PVC-U EN 1452-2 and
 * EN 1401-1 (d 12–1000 mm, SDR 13.6–51); GRP EN 1796 / ISO 10467 (DN 100–4000); steel EN 10220
 * (d 10.2–2540 mm); ductile iron EN 545 / EN 598 (DN 40–2000, d 56–2050 mm); concrete EN 1916
 * (DN 150–4000, walls about DN/12 + 25 mm); vitrified clay EN 295-1 (DN 100–1400). Moduli and
 * strengths: methods.md §9 (typical values) widened by about ±50 % (project choice).
 */
export interface MaterialPlausibility {
  outerDiameter_m: readonly [number, number]
  /** Outer diameter over wall thickness (SDR for plastics). */
  diameterToWall: readonly [number, number]
  shortTermModulus_MPa: readonly [number, number]
  longTermModulus_MPa: readonly [number, number]
  allowableStress_MPa: readonly [number, number]
}

export const MATERIAL_PLAUSIBILITY: Readonly<Record<PipeMaterial, MaterialPlausibility>> = {
  PE100: {
    outerDiameter_m: [0.016, 2.5],
    diameterToWall: [6, 41],
    shortTermModulus_MPa: [600, 1600],
    longTermModulus_MPa: [100, 500],
    allowableStress_MPa: [4, 12],
  },
  'PVC-U': {
    outerDiameter_m: [0.012, 1.0],
    diameterToWall: [13, 51],
    shortTermModulus_MPa: [2500, 4200],
    longTermModulus_MPa: [1000, 2200],
    allowableStress_MPa: [5, 16],
  },
  GRP: {
    outerDiameter_m: [0.1, 4.2],
    diameterToWall: [15, 200],
    shortTermModulus_MPa: [5000, 50_000],
    longTermModulus_MPa: [2000, 40_000],
    allowableStress_MPa: [10, 300],
  },
  steel: {
    outerDiameter_m: [0.01, 2.6],
    diameterToWall: [5, 300],
    shortTermModulus_MPa: [190_000, 215_000],
    longTermModulus_MPa: [190_000, 215_000],
    allowableStress_MPa: [50, 400],
  },
  'ductile-iron': {
    outerDiameter_m: [0.05, 2.1],
    diameterToWall: [8, 150],
    shortTermModulus_MPa: [150_000, 180_000],
    longTermModulus_MPa: [150_000, 180_000],
    allowableStress_MPa: [50, 300],
  },
  concrete: {
    outerDiameter_m: [0.2, 4.8],
    diameterToWall: [5, 25],
    shortTermModulus_MPa: [20_000, 50_000],
    longTermModulus_MPa: [10_000, 50_000],
    allowableStress_MPa: [0.5, 10],
  },
  'vitrified-clay': {
    outerDiameter_m: [0.1, 1.7],
    diameterToWall: [5, 25],
    shortTermModulus_MPa: [30_000, 70_000],
    longTermModulus_MPa: [30_000, 70_000],
    allowableStress_MPa: [3, 25],
  },
}
