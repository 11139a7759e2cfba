/**
 * A crane on one square 1.5 m mat at a lon/lat point, and the leg load chosen with the engine
 * for the PE100 water main fixture (see the preconditions in coordination-screening.test.ts):
 * one such crane right above the main keeps it clear (buckling about 0.9 of capacity), two mats
 * 1.6 m apart make it critical.
 */
export const LEG_LOAD_KN = 1300

export const craneAt = (coordinates: [number, number], load_kN = LEG_LOAD_KN) => ({
  kind: 'crane',
  label: 'Mobile crane',
  setup: 'single-pad',
  geometry: { type: 'Point', coordinates },
  legLoad_kN: load_kN,
  matLength_m: 1.5,
  matWidth_m: 1.5,
  matRotation_deg: 0,
})
