/** Plain names of the engine's checks (ids from shared/statics), for tables and panels. */
const CHECK_NAMES: Record<string, string> = {
  'hoop-stress': 'Wall stress from internal pressure',
  'ring-deflection': 'Ring deflection',
  buckling: 'Buckling of the wall',
  crushing: 'Crushing strength',
  'ring-bending': 'Ring bending stress',
  'exposed-span': 'Exposed span',
}

/** The plain name of a check, or its id with dashes turned to spaces when it is new to us. */
export function checkName(id: string | null | undefined): string {
  if (!id) return '—'
  const name = CHECK_NAMES[id]
  if (name) return name
  const words = id.replace(/[-_]/g, ' ')
  return words.charAt(0).toUpperCase() + words.slice(1)
}
