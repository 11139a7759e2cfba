/**
 * Vertical stress in a homogeneous, isotropic, linear-elastic half-space under surface loads
 * (Boussinesq). Rectangles are solved exactly by Newmark's corner formula with signed
 * superposition; polygons exactly by integrating the point solution over the polygon edge by
 * edge (our derivation, checked against Newmark and the circular-area formula in the tests).
 */
import { requireInRange, requireNonNegative } from './guards.ts'
import type { RectangleFootprint } from './types.ts'

const TWO_PI = 2 * Math.PI

/**
 * Returns the Boussinesq point-load influence factor I_p = (3/2π)·[1 + (r/z)²]^(−5/2)
 * (dimensionless), so that Δσ_z = (Q/z²)·I_p.
 *
 * @param offsetOverDepth - r/z, dimensionless, [0, ∞)
 * @returns I_p, dimensionless
 *
 * Source: Boussinesq point load, UFC 3-220-10 Table 4-2 [S2] (methods.md 4.1).
 */
export function boussinesqPointInfluenceFactor(offsetOverDepth: number): number {
  requireInRange('offsetOverDepth', offsetOverDepth, 0, Infinity)
  return (3 / TWO_PI) * Math.pow(1 + offsetOverDepth * offsetOverDepth, -2.5)
}

/**
 * Returns the vertical stress in kPa at depth z and horizontal distance r from a vertical point
 * load Q at the surface: Δσ_z = 3·Q·z³ / (2π·R⁵), R = √(r² + z²).
 *
 * @param load_kN - Q, kN, [0, 1e6]
 * @param offset_m - horizontal distance r, m, [0, ∞)
 * @param depth_m - depth z, m, (0, 1000]
 * @returns Δσ_z, kPa
 *
 * Source: UFC 3-220-10 Table 4-2 [S2] (methods.md 4.1).
 */
export function boussinesqPointStress_kPa(
  load_kN: number,
  offset_m: number,
  depth_m: number,
): number {
  requireInRange('load_kN', load_kN, 0, 1e6)
  requireNonNegative('offset_m', offset_m)
  requireInRange('depth_m', depth_m, 0, 1000, { minExclusive: true })
  return (load_kN / (depth_m * depth_m)) * boussinesqPointInfluenceFactor(offset_m / depth_m)
}

/**
 * Returns Newmark's influence factor I(m, n) for the corner of a uniformly loaded rectangle
 * B × L at depth z (dimensionless, 0 ≤ I ≤ 0.25), m = B/z, n = L/z. Either may be Infinity.
 *
 * I = (1/2π)·[atan2(mn, √V) + (mn/√V)·(1/(1 + m²) + 1/(1 + n²))], V = m² + n² + 1.
 *
 * @param widthOverDepth - m = B/z, dimensionless, [0, ∞]
 * @param lengthOverDepth - n = L/z, dimensionless, [0, ∞]
 * @returns I, dimensionless
 *
 * Source: Newmark (1935), Univ. of Illinois Eng. Exp. Station Circular 24; Fadum (1948);
 * atan2 form of UFC 3-220-10 Table 4-2 [S2] (methods.md 4.2).
 */
export function newmarkCornerInfluenceFactor(
  widthOverDepth: number,
  lengthOverDepth: number,
): number {
  if (Number.isNaN(widthOverDepth) || widthOverDepth < 0) {
    throw new RangeError(`widthOverDepth must be >= 0 (got ${widthOverDepth})`)
  }
  if (Number.isNaN(lengthOverDepth) || lengthOverDepth < 0) {
    throw new RangeError(`lengthOverDepth must be >= 0 (got ${lengthOverDepth})`)
  }
  return cornerInfluence(widthOverDepth, lengthOverDepth)
}

/** Unchecked Newmark corner factor (inputs ≥ 0, possibly Infinity); the hot path of the engine. */
function cornerInfluence(m: number, n: number): number {
  if (m === 0 || n === 0) return 0
  const mInfinite = m === Infinity
  const nInfinite = n === Infinity
  if (mInfinite && nInfinite) return 0.25
  // One side infinite: the limit of the closed form, I(m, ∞) = (1/2π)·[atan(m) + m/(1 + m²)].
  if (nInfinite) return (Math.atan(m) + m / (1 + m * m)) / TWO_PI
  if (mInfinite) return (Math.atan(n) + n / (1 + n * n)) / TWO_PI
  const m2 = m * m
  const n2 = n * n
  const ratio = (m * n) / Math.sqrt(m2 + n2 + 1)
  // atan2(mn, √V) = atan(mn/√V) here because √V > 0 (the branch issue of the atan form is avoided).
  return (Math.atan(ratio) + ratio * (1 / (1 + m2) + 1 / (1 + n2))) / TWO_PI
}

/** Signed corner integral: the stress factor of the rectangle spanning [0, a] × [0, b]. */
function signedCorner(a: number, b: number, depth_m: number): number {
  if (a === 0 || b === 0) return 0
  const value = cornerInfluence(Math.abs(a) / depth_m, Math.abs(b) / depth_m)
  return a > 0 === b > 0 ? value : -value
}

/**
 * Returns the vertical stress in kPa at depth z below the plan point (x, y) from a uniform
 * pressure on an axis-aligned rectangle, by Newmark's corner formula and signed superposition
 * of the four corner rectangles (valid for points inside, on the edge of, or outside the area).
 *
 * @param pressure_kPa - uniform surface pressure q, kPa, [0, 1e5]
 * @param rectangle - loaded area, m (xMin_m < xMax_m, yMin_m < yMax_m)
 * @param x_m - plan x of the point, m, finite
 * @param y_m - plan y of the point, m, finite
 * @param depth_m - depth z, m, (0, 1000]
 * @returns Δσ_z, kPa
 *
 * Source: Newmark (1935) corner formula with superposition (methods.md 4.2).
 */
export function rectangleStress_kPa(
  pressure_kPa: number,
  rectangle: RectangleFootprint,
  x_m: number,
  y_m: number,
  depth_m: number,
): number {
  requireInRange('pressure_kPa', pressure_kPa, 0, 1e5)
  requireInRange('x_m', x_m, -Infinity, Infinity)
  requireInRange('y_m', y_m, -Infinity, Infinity)
  requireInRange('depth_m', depth_m, 0, 1000, { minExclusive: true })
  if (!(rectangle.xMin_m < rectangle.xMax_m) || !(rectangle.yMin_m < rectangle.yMax_m)) {
    throw new RangeError('rectangle must have xMin_m < xMax_m and yMin_m < yMax_m')
  }
  return rectangleStressUnchecked(pressure_kPa, rectangle, x_m, y_m, depth_m)
}

/** Unchecked rectangle stress (the engine validates its inputs once, up front). */
export function rectangleStressUnchecked(
  pressure_kPa: number,
  rectangle: RectangleFootprint,
  x_m: number,
  y_m: number,
  depth_m: number,
): number {
  const a1 = rectangle.xMin_m - x_m
  const a2 = rectangle.xMax_m - x_m
  const b1 = rectangle.yMin_m - y_m
  const b2 = rectangle.yMax_m - y_m
  const factor =
    signedCorner(a2, b2, depth_m) -
    signedCorner(a1, b2, depth_m) -
    signedCorner(a2, b1, depth_m) +
    signedCorner(a1, b1, depth_m)
  // Rounding can leave a tiny negative value far from the load; stress from a pressure is >= 0.
  return factor > 0 ? pressure_kPa * factor : 0
}

/**
 * Returns the vertical stress in kPa at depth z below the plan point (x, y) from a uniform
 * pressure on a simple polygon (either orientation, convex or not).
 *
 * Method: the stress under a point from a uniform sector of radius ρ and angle dθ is
 * q·dθ/(2π)·[1 − (1 + ρ²/z²)^(−3/2)] (the circular-area solution). Summing that over the angle
 * each edge subtends, with signs, integrates the Boussinesq kernel over the polygon exactly; the
 * angular integral along a straight edge has a closed form. Points outside the polygon get
 * cancelling contributions, points on an edge or vertex are handled by the same sum.
 *
 * @param pressure_kPa - uniform surface pressure q, kPa, [0, 1e5]
 * @param vertices_m - polygon vertices [x, y] in m, at least 3, not closed (first ≠ last needed)
 * @param x_m - plan x of the point, m
 * @param y_m - plan y of the point, m
 * @param depth_m - depth z, m, (0, 1000]
 * @returns Δσ_z, kPa
 *
 * Source: integration of the Boussinesq point solution (UFC 3-220-10 Table 4-2 [S2]) using the
 * circular-area formula of the same table; [C] our derivation, verified against Newmark
 * rectangles (methods.md 4.2) in tests/shared/statics/boussinesq.test.ts.
 */
export function polygonStress_kPa(
  pressure_kPa: number,
  vertices_m: ReadonlyArray<readonly [number, number]>,
  x_m: number,
  y_m: number,
  depth_m: number,
): number {
  requireInRange('pressure_kPa', pressure_kPa, 0, 1e5)
  requireInRange('x_m', x_m, -Infinity, Infinity)
  requireInRange('y_m', y_m, -Infinity, Infinity)
  requireInRange('depth_m', depth_m, 0, 1000, { minExclusive: true })
  if (vertices_m.length < 3) throw new RangeError('vertices_m must have at least 3 vertices')
  for (const [vx, vy] of vertices_m) {
    requireInRange('vertices_m', vx, -Infinity, Infinity)
    requireInRange('vertices_m', vy, -Infinity, Infinity)
  }
  return polygonStressUnchecked(pressure_kPa, vertices_m, x_m, y_m, depth_m)
}

/** Unchecked polygon stress (the engine validates its inputs once, up front). */
export function polygonStressUnchecked(
  pressure_kPa: number,
  vertices_m: ReadonlyArray<readonly [number, number]>,
  x_m: number,
  y_m: number,
  depth_m: number,
): number {
  const z = depth_m
  const z2 = z * z
  const count = vertices_m.length
  let sum = 0
  let twiceArea = 0
  const last = vertices_m[count - 1] as readonly [number, number]
  let px = last[0] - x_m
  let py = last[1] - y_m
  for (let i = 0; i < count; i++) {
    const vertex = vertices_m[i] as readonly [number, number]
    const qx = vertex[0] - x_m
    const qy = vertex[1] - y_m
    const cross = px * qy - py * qx
    twiceArea += cross
    const ex = qx - px
    const ey = qy - py
    const length = Math.sqrt(ex * ex + ey * ey)
    if (length > 0) {
      const d = Math.abs(cross) / length
      // An edge on a line through the point subtends no angle and adds nothing.
      if (d > 1e-12 * (length + z)) {
        const t1 = (px * ex + py * ey) / length
        const t2 = (qx * ex + qy * ey) / length
        const a = z2 + d * d
        const contribution = edgeAngleIntegral(t2, d, z, a) - edgeAngleIntegral(t1, d, z, a)
        sum += cross > 0 ? contribution : -contribution
      }
    }
    px = qx
    py = qy
  }
  const stress = (pressure_kPa * (twiceArea >= 0 ? sum : -sum)) / TWO_PI
  return stress > 0 ? stress : 0
}

/**
 * Antiderivative along one edge of ∫[1 − z³cos³φ/(z²cos²φ + d²)^{3/2}] dφ, written in the edge
 * coordinate t = d·tan φ: h(t) = atan2(t, d) − atan2(z·t, d·R) + z·d·t/((z² + d²)·R),
 * R = √(t² + d² + z²).
 */
function edgeAngleIntegral(t: number, d: number, z: number, zSquaredPlusDSquared: number): number {
  const r = Math.sqrt(t * t + zSquaredPlusDSquared)
  // d > 0 and r > 0, so atan2(a, b) = atan(a/b) for both angles.
  return Math.atan(t / d) - Math.atan((z * t) / (d * r)) + (z * d * t) / (zSquaredPlusDSquared * r)
}

/**
 * Returns the vertical stress in kPa under the centre of a uniformly loaded circle:
 * Δσ_z = q·(1 − [1 + (a/z)²]^(−3/2)).
 *
 * @param pressure_kPa - q, kPa, [0, 1e5]
 * @param radius_m - a, m, (0, 1e4]
 * @param depth_m - z, m, (0, 1000]
 * @returns Δσ_z, kPa
 *
 * Source: UFC 3-220-10 Table 4-2 [S2] (methods.md 4.2, circular area).
 */
export function circleCentreStress_kPa(
  pressure_kPa: number,
  radius_m: number,
  depth_m: number,
): number {
  requireInRange('pressure_kPa', pressure_kPa, 0, 1e5)
  requireInRange('radius_m', radius_m, 0, 1e4, { minExclusive: true })
  requireInRange('depth_m', depth_m, 0, 1000, { minExclusive: true })
  const ratio = radius_m / depth_m
  return pressure_kPa * (1 - Math.pow(1 + ratio * ratio, -1.5))
}

/**
 * Returns the vertical stress in kPa under an infinitely long strip of width B and uniform
 * pressure q, at depth z and horizontal distance x from the strip's centre line:
 * Δσ_z = (q/π)·[(θ2 − θ1) + sin θ2·cos θ2 − sin θ1·cos θ1], θ_i = atan(x_i/z) for the strip
 * edges x_i measured from the point (equivalent to (q/π)·[α + sin α·cos(α + 2δ)]).
 *
 * @param pressure_kPa - q, kPa, [0, 1e5]
 * @param width_m - B, m, (0, 1e4]
 * @param offsetFromCentre_m - x, m, finite
 * @param depth_m - z, m, (0, 1000]
 * @returns Δσ_z, kPa
 *
 * Source: strip load, UFC 3-220-10 Table 4-2 [S2] (methods.md 4.3).
 */
export function stripStress_kPa(
  pressure_kPa: number,
  width_m: number,
  offsetFromCentre_m: number,
  depth_m: number,
): number {
  requireInRange('pressure_kPa', pressure_kPa, 0, 1e5)
  requireInRange('width_m', width_m, 0, 1e4, { minExclusive: true })
  requireInRange('offsetFromCentre_m', offsetFromCentre_m, -Infinity, Infinity)
  requireInRange('depth_m', depth_m, 0, 1000, { minExclusive: true })
  const near = -offsetFromCentre_m - width_m / 2
  const far = -offsetFromCentre_m + width_m / 2
  const theta1 = Math.atan(near / depth_m)
  const theta2 = Math.atan(far / depth_m)
  const value =
    (pressure_kPa / Math.PI) *
    (theta2 - theta1 + Math.sin(theta2) * Math.cos(theta2) - Math.sin(theta1) * Math.cos(theta1))
  return value > 0 ? value : 0
}
