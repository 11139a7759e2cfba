/**
 * Input guards shared by every statics function: each rejects a non-finite or out-of-range
 * number by throwing a RangeError whose message starts with the parameter's name, so a caller
 * (server, CLI, client preview) can tell the user which input is wrong.
 */

/**
 * Returns `value` when it is a finite number within [min, max] (bounds inclusive unless told
 * otherwise); otherwise throws a RangeError naming `name`.
 *
 * @param name - the parameter's name as the caller spells it (e.g. `cover_m`, `pipe.cover_m`)
 * @param value - the number to check
 * @param min - lower bound (use -Infinity for none)
 * @param max - upper bound (use Infinity for none)
 * @param options - `minExclusive` / `maxExclusive` make the bound strict
 */
export function requireInRange(
  name: string,
  value: number,
  min: number,
  max: number,
  options: { minExclusive?: boolean; maxExclusive?: boolean } = {},
): number {
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new RangeError(`${name} must be a finite number (got ${String(value)})`)
  }
  const belowMin = options.minExclusive ? value <= min : value < min
  const aboveMax = options.maxExclusive ? value >= max : value > max
  if (belowMin || aboveMax) {
    const lower = `${options.minExclusive ? '(' : '['}${min}`
    const upper = `${max}${options.maxExclusive ? ')' : ']'}`
    throw new RangeError(`${name} must be in ${lower}, ${upper} (got ${value})`)
  }
  return value
}

/** Returns `value` when it is finite and > 0; otherwise throws a RangeError naming `name`. */
export function requirePositive(name: string, value: number): number {
  return requireInRange(name, value, 0, Infinity, { minExclusive: true })
}

/** Returns `value` when it is finite and >= 0; otherwise throws a RangeError naming `name`. */
export function requireNonNegative(name: string, value: number): number {
  return requireInRange(name, value, 0, Infinity)
}
