/**
 * Number formatting for the plain-English texts of the engine output.
 */

const POWERS_OF_TEN = [1, 10, 100, 1000, 10_000, 100_000, 1_000_000]

/**
 * Formats a number with a fixed number of decimals (0–6), rounding half away from zero, without a
 * negative zero. Faster than Number#toFixed, which matters because every assessment writes some
 * sixty numbers into its texts.
 */
export function fixed(value: number, decimals: number): string {
  const scale = POWERS_OF_TEN[decimals]
  if (scale === undefined || !Number.isFinite(value) || Math.abs(value) >= 1e15) {
    const text = value.toFixed(decimals)
    return text.charCodeAt(0) === 45 && Number(text) === 0 ? text.slice(1) : text
  }
  const scaled = Math.round(Math.abs(value) * scale)
  if (scaled === 0) return decimals === 0 ? '0' : `0.${'0'.repeat(decimals)}`
  const sign = value < 0 ? '-' : ''
  if (decimals === 0) return `${sign}${scaled}`
  const whole = Math.floor(scaled / scale)
  const fraction = String(scaled - whole * scale).padStart(decimals, '0')
  return `${sign}${whole}.${fraction}`
}

/** Formats a ratio as a whole percentage, e.g. 0.4567 → '46 %'. */
export function percent(ratio: number): string {
  return `${Math.round(ratio * 100)} %`
}

/** Joins words as 'a', 'a and b', 'a, b and c'. */
export function joinWords(words: readonly string[]): string {
  if (words.length <= 1) return words.join('')
  return `${words.slice(0, -1).join(', ')} and ${words[words.length - 1]}`
}
