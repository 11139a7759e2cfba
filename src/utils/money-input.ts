/** Amounts typed as currency units ("95", "95.5", "95.50") to whole cents; null when not a plain amount. */
export function centsFromInput(text: string): number | null {
  const t = text.trim().replace(',', '.')
  if (!/^\d{1,8}(\.\d{1,2})?$/.test(t)) return null
  const [units, frac = ''] = t.split('.')
  return Number(units) * 100 + Number(frac.padEnd(2, '0'))
}

/** Whole cents as the text of an amount field ("95.00"). */
export const inputFromCents = (cents: number) => (cents / 100).toFixed(2)
