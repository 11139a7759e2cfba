/**
 * An amount in whole cents as text with two decimals and the currency code: 12345 EUR →
 * "EUR 123.45", thousands grouped with commas ("EUR 1,250.00"), the same on screens, mails and PDFs.
 */
export function formatAmount(amount_cents: number, currency: string): string {
  if (!Number.isInteger(amount_cents))
    throw new RangeError(`amount_cents must be whole (got ${amount_cents})`)
  const sign = amount_cents < 0 ? '-' : ''
  const abs = Math.abs(amount_cents)
  const units = Math.floor(abs / 100)
  const cents = String(abs % 100).padStart(2, '0')
  return `${currency.toUpperCase()} ${sign}${String(units).replace(/\B(?=(\d{3})+(?!\d))/g, ',')}.${cents}`
}
