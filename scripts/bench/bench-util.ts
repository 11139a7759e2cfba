/**
 * Small helpers shared by the benchmarks: timing, percentiles and the printed tables.
 * Every figure is printed beside a floor measured in the same run (the machine may be shared,
 * so absolute times move; the ratio to the floor is what the benchmarks compare).
 */
import { availableParallelism, loadavg } from 'node:os'

/** Milliseconds since t0 (process.hrtime.bigint()). */
export const msSince = (t0: bigint): number => Number(process.hrtime.bigint() - t0) / 1e6

/** The p-th percentile (0-100) of the values, nearest rank. */
export function percentile(values: readonly number[], p: number): number {
  if (!values.length) return NaN
  const sorted = [...values].sort((a, b) => a - b)
  const rank = Math.min(sorted.length - 1, Math.max(0, Math.ceil((p / 100) * sorted.length) - 1))
  return sorted[rank]!
}

/**
 * Time fn runs times after warm-up runs; returns the durations in ms. When fn returns a number,
 * that is taken as its own measured duration (to leave set-up and clean-up out).
 */
export async function timeRuns(
  runs: number,
  warmUp: number,
  fn: (i: number) => Promise<unknown>,
): Promise<number[]> {
  for (let i = 0; i < warmUp; i++) await fn(-1 - i)
  const out: number[] = []
  for (let i = 0; i < runs; i++) {
    const t0 = process.hrtime.bigint()
    const own = await fn(i)
    out.push(typeof own === 'number' ? own : msSince(t0))
  }
  return out
}

/** Print a table: a title, a header row and rows, columns padded (numbers right-aligned). */
export function printTable(title: string, head: string[], rows: (string | number)[][]): void {
  const cells = [head, ...rows.map((r) => r.map(String))]
  const widths = head.map((_, c) => Math.max(...cells.map((r) => (r[c] ?? '').length)))
  const line = (r: string[]) =>
    r
      .map((v, c) =>
        c === 0 || Number.isNaN(Number(v.replace(/[×,%]/g, '')))
          ? v.padEnd(widths[c]!)
          : v.padStart(widths[c]!),
      )
      .join('  ')
  console.log(`\n${title}`)
  console.log('  ' + line(head))
  console.log('  ' + widths.map((w) => '-'.repeat(w)).join('  '))
  for (const r of cells.slice(1)) console.log('  ' + line(r))
}

/** The machine load when the benchmark ran: load averages and cores. */
export function machineLoad(): string {
  const [one, five] = loadavg()
  return `load average ${one!.toFixed(2)} (1 min), ${five!.toFixed(2)} (5 min) on ${availableParallelism()} cores`
}

export const fmt = (v: number, digits = 1): string => (Number.isFinite(v) ? v.toFixed(digits) : '–')
export const ratio = (v: number, floor: number): string => `${(v / floor).toFixed(1)}×`
