/**
 * Surcharge at the pipe crown from surface loads (pads, areas, fills): the sum of the Boussinesq
 * stresses of all loads, searched along the pipe axis (x = 0) at crown depth for its largest
 * value. Rectangles use Newmark's corner formula, polygons the exact edge integration.
 */
import { polygonStressUnchecked, rectangleStressUnchecked } from './boussinesq.ts'
import {
  footprintArea_m2,
  footprintBounds,
  isPolygonFootprint,
  type Bounds,
} from './footprint-geometry.ts'
import type { Footprint, LoadDuration, SurfaceLoadActivity } from './types.ts'

/** A uniform surface pressure on a footprint, ready for the stress calculation. */
export interface SurfaceLoad {
  id: string
  pressure_kPa: number
  footprint: Footprint
  bounds: Bounds
  /** Long-term loads use the pipe's long-term modulus and the lag factor (methods.md 9). */
  duration: LoadDuration
}

/** Largest number of refinement steps of the peak search. */
const PEAK_REFINEMENT_MAX_STEPS = 12
/** The peak search stops when its bracket is narrower than this share of the crown depth. */
const PEAK_BRACKET_TOLERANCE = 1e-4
const GOLDEN = (3 - Math.sqrt(5)) / 2

/**
 * Returns the uniform surface pressure in kPa of a pad, area or fill activity: load/area for a
 * pad, the given pressure for an area, height·unit weight for a fill.
 *
 * Source: issue 3 ("A pad spreads load_kN uniformly over its footprint"; "A fill adds
 * height_m * unitWeight"); methods.md 4.6 (q = F/A_mat; q = γ·height).
 */
export function surfaceLoadPressure_kPa(activity: SurfaceLoadActivity): number {
  switch (activity.kind) {
    case 'pad':
      return activity.load_kN / footprintArea_m2(activity.footprint)
    case 'area':
      return activity.pressure_kPa
    case 'fill':
      return activity.height_m * activity.unitWeight_kN_per_m3
  }
}

/**
 * Returns the default load duration of an activity: crane pads are short-term (hours); areas and
 * fills (stockpiles, embankments) may stay for weeks and count as long-term for plastics.
 *
 * Source: methods.md 9 ("A crane load lasting hours is short-term. A stockpile left for weeks or
 * months should be treated as long-term for plastics").
 */
export function defaultLoadDuration(kind: SurfaceLoadActivity['kind']): LoadDuration {
  return kind === 'pad' ? 'short-term' : 'long-term'
}

/** Builds the surface loads of the given activities. */
export function surfaceLoadOf(activity: SurfaceLoadActivity): SurfaceLoad {
  return {
    id: activity.id,
    pressure_kPa: surfaceLoadPressure_kPa(activity),
    footprint: activity.footprint,
    bounds: footprintBounds(activity.footprint),
    duration: activity.loadDuration ?? defaultLoadDuration(activity.kind),
  }
}

/** Returns one load's vertical stress in kPa at (x_m, y_m) and depth_m. */
export function surfaceLoadStress_kPa(
  load: SurfaceLoad,
  x_m: number,
  y_m: number,
  depth_m: number,
): number {
  return isPolygonFootprint(load.footprint)
    ? polygonStressUnchecked(load.pressure_kPa, load.footprint.polygon_m, x_m, y_m, depth_m)
    : rectangleStressUnchecked(load.pressure_kPa, load.footprint, x_m, y_m, depth_m)
}

/** Returns the summed vertical stress in kPa of all loads on the pipe axis (x = 0) at y_m. */
export function axisSurcharge_kPa(
  loads: readonly SurfaceLoad[],
  y_m: number,
  depth_m: number,
): number {
  let total = 0
  for (const load of loads) total += surfaceLoadStress_kPa(load, 0, y_m, depth_m)
  return total
}

/**
 * A load prepared for repeated evaluation on the pipe axis at one depth. For a rectangle the
 * terms of Newmark's corner formula that depend only on x (m = |x_i|/z and 1/(1 + m²)) are
 * computed once; the result is the same corner-formula superposition as rectangleStress_kPa.
 */
interface AxisLoad {
  load: SurfaceLoad
  rectangle: boolean
  signX1: number
  signX2: number
  m1: number
  m2: number
  m1sq: number
  m2sq: number
  invM1: number
  invM2: number
}

function prepareAxisLoad(load: SurfaceLoad, depth_m: number): AxisLoad {
  const a1 = load.bounds.xMin_m
  const a2 = load.bounds.xMax_m
  const m1 = Math.abs(a1) / depth_m
  const m2 = Math.abs(a2) / depth_m
  return {
    load,
    rectangle: !isPolygonFootprint(load.footprint),
    signX1: a1 > 0 ? 1 : a1 < 0 ? -1 : 0,
    signX2: a2 > 0 ? 1 : a2 < 0 ? -1 : 0,
    m1,
    m2,
    m1sq: m1 * m1,
    m2sq: m2 * m2,
    invM1: 1 / (1 + m1 * m1),
    invM2: 1 / (1 + m2 * m2),
  }
}

/** Newmark corner factor from precomputed terms (m > 0, n > 0). */
function corner(
  m: number,
  mSquared: number,
  invM: number,
  n: number,
  nSquared: number,
  invN: number,
): number {
  const ratio = (m * n) / Math.sqrt(mSquared + nSquared + 1)
  return (Math.atan(ratio) + ratio * (invM + invN)) / (2 * Math.PI)
}

function preparedAxisSurcharge_kPa(
  prepared: readonly AxisLoad[],
  y_m: number,
  depth_m: number,
): number {
  let total = 0
  for (const p of prepared) {
    if (!p.rectangle) {
      total += surfaceLoadStress_kPa(p.load, 0, y_m, depth_m)
      continue
    }
    const b1 = p.load.bounds.yMin_m - y_m
    const b2 = p.load.bounds.yMax_m - y_m
    const n1 = Math.abs(b1) / depth_m
    const n2 = Math.abs(b2) / depth_m
    const n1sq = n1 * n1
    const n2sq = n2 * n2
    const invN1 = 1 / (1 + n1sq)
    const invN2 = 1 / (1 + n2sq)
    const s1 = b1 > 0 ? 1 : b1 < 0 ? -1 : 0
    const s2 = b2 > 0 ? 1 : b2 < 0 ? -1 : 0
    let factor = 0
    if (p.signX2 !== 0 && s2 !== 0)
      factor += p.signX2 * s2 * corner(p.m2, p.m2sq, p.invM2, n2, n2sq, invN2)
    if (p.signX1 !== 0 && s2 !== 0)
      factor -= p.signX1 * s2 * corner(p.m1, p.m1sq, p.invM1, n2, n2sq, invN2)
    if (p.signX2 !== 0 && s1 !== 0)
      factor -= p.signX2 * s1 * corner(p.m2, p.m2sq, p.invM2, n1, n1sq, invN1)
    if (p.signX1 !== 0 && s1 !== 0)
      factor += p.signX1 * s1 * corner(p.m1, p.m1sq, p.invM1, n1, n1sq, invN1)
    if (factor > 0) total += p.load.pressure_kPa * factor
  }
  return total
}

/** Peak surcharge on the pipe axis and where it occurs. */
export interface SurchargePeak {
  surcharge_kPa: number
  y_m: number
}

/**
 * Returns the largest summed vertical stress on the pipe axis (x = 0) at depth_m over all y,
 * and its position. Each rectangle's stress along the axis is symmetric about its centre line and
 * falls away from it, so the peak of the sum lies between the outermost centre lines. Method:
 * evaluate at every load's centre line and half-way between neighbouring centre lines; take the
 * best and its two neighbours (at least depth/2 away) as a bracket; refine by successive parabolic
 * interpolation, safeguarded by golden-section steps, until the bracket is narrower than 1e-4 of
 * the depth. The stress is smooth in y, so this converges in a few steps. A single rectangle's
 * peak is taken exactly at its centre line.
 *
 * @param loads - surface loads (may be empty: the result is 0 at y = 0)
 * @param depth_m - crown depth, m, > 0
 */
export function peakAxisSurcharge(loads: readonly SurfaceLoad[], depth_m: number): SurchargePeak {
  if (loads.length === 0) return { surcharge_kPa: 0, y_m: 0 }
  const first = loads[0] as SurfaceLoad
  if (loads.length === 1 && !isPolygonFootprint(first.footprint)) {
    const y = (first.bounds.yMin_m + first.bounds.yMax_m) / 2
    return { surcharge_kPa: axisSurcharge_kPa(loads, y, depth_m), y_m: y }
  }
  const prepared = loads.map((load) => prepareAxisLoad(load, depth_m))
  const centres = loads
    .map((load) => (load.bounds.yMin_m + load.bounds.yMax_m) / 2)
    .sort((a, b) => a - b)
  const ys: number[] = []
  for (const centre of centres) {
    const previous = ys[ys.length - 1]
    if (previous === undefined || centre - previous > 1e-6) {
      if (previous !== undefined) ys.push((previous + centre) / 2)
      ys.push(centre)
    }
  }
  const values = ys.map((y) => preparedAxisSurcharge_kPa(prepared, y, depth_m))
  let bestIndex = 0
  for (let i = 1; i < values.length; i++)
    if ((values[i] as number) > (values[bestIndex] as number)) bestIndex = i
  const halfDepth = depth_m / 2
  let x1 = ys[bestIndex] as number
  let f1 = values[bestIndex] as number
  let x0 = ys[bestIndex - 1] ?? x1 - halfDepth
  let f0 =
    ys[bestIndex - 1] === undefined
      ? preparedAxisSurcharge_kPa(prepared, x0, depth_m)
      : (values[bestIndex - 1] as number)
  let x2 = ys[bestIndex + 1] ?? x1 + halfDepth
  let f2 =
    ys[bestIndex + 1] === undefined
      ? preparedAxisSurcharge_kPa(prepared, x2, depth_m)
      : (values[bestIndex + 1] as number)
  // Widen a side that is still rising (possible only at the ends of the candidate list).
  for (let i = 0; i < 8 && f0 > f1; i++) {
    x2 = x1
    f2 = f1
    x1 = x0
    f1 = f0
    x0 = x1 - halfDepth
    f0 = preparedAxisSurcharge_kPa(prepared, x0, depth_m)
  }
  for (let i = 0; i < 8 && f2 > f1; i++) {
    x0 = x1
    f0 = f1
    x1 = x2
    f1 = f2
    x2 = x1 + halfDepth
    f2 = preparedAxisSurcharge_kPa(prepared, x2, depth_m)
  }
  const tolerance = PEAK_BRACKET_TOLERANCE * depth_m
  for (let step = 0; step < PEAK_REFINEMENT_MAX_STEPS && x2 - x0 > tolerance; step++) {
    const p = (x1 - x0) * (f1 - f2)
    const q = (x1 - x2) * (f1 - f0)
    const denominator = 2 * (p - q)
    let x = denominator !== 0 ? x1 - ((x1 - x0) * p - (x1 - x2) * q) / denominator : NaN
    const margin = 0.01 * (x2 - x0)
    if (!(x > x0 + margin && x < x2 - margin) || Math.abs(x - x1) < 1e-3 * tolerance) {
      // Safeguard: a golden-section step into the larger half of the bracket.
      x = x2 - x1 > x1 - x0 ? x1 + GOLDEN * (x2 - x1) : x1 - GOLDEN * (x1 - x0)
    }
    const fx = preparedAxisSurcharge_kPa(prepared, x, depth_m)
    if (fx >= f1) {
      if (x > x1) {
        x0 = x1
        f0 = f1
      } else {
        x2 = x1
        f2 = f1
      }
      x1 = x
      f1 = fx
    } else if (x > x1) {
      x2 = x
      f2 = fx
    } else {
      x0 = x
      f0 = fx
    }
  }
  return { surcharge_kPa: f1, y_m: x1 }
}
