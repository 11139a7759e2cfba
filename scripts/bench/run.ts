/**
 * Runs the benchmarks one after another, each in its own process (so one's memory and timers do
 * not colour the next), and prints their tables. Every table carries its own floor measured in
 * the same run; compare ratios, not absolute times, on a shared machine.
 * Usage: npm run bench [-- name ...]   names: engine screening api import pdf bundle map rescreen
 *   map-lines. The default is all but rescreen and map-lines. The first run loads the synthetic
 *   city (10,000, 100,000 and 1,000,000 segments) into its bench databases, which takes minutes.
 */
import { spawnSync } from 'node:child_process'
import { join } from 'node:path'
import { ROOT } from '../../tests/helpers/local-env.ts'

const BENCHES: Record<string, string[]> = {
  engine: ['engine.ts'],
  screening: ['screening-scale.ts', '40'],
  api: ['api-throughput.ts', '1000000', '10', '10'],
  import: ['import-network.ts', '100000'],
  pdf: ['permit-pdf.ts', '30', '10000'],
  bundle: ['client-bundle.ts', '--build'],
  map: ['map-browser.ts', '3'],
  rescreen: ['rescreen.ts'],
  'map-lines': ['map-lines.ts', 'trenchward_bench'],
}
const DEFAULT = ['engine', 'screening', 'api', 'import', 'pdf', 'bundle', 'map']

const names = process.argv.slice(2).length ? process.argv.slice(2) : DEFAULT
for (const n of names) if (!BENCHES[n]) throw new Error(`unknown benchmark ${n}`)
let failed = 0
for (const n of names) {
  const [file, ...args] = BENCHES[n]!
  console.log(`\n=== ${n}: scripts/bench/${file} ${args.join(' ')}`)
  const r = spawnSync(
    process.execPath,
    ['--import', 'tsx', join(ROOT, 'scripts', 'bench', file!), ...args],
    {
      cwd: ROOT,
      stdio: 'inherit',
    },
  )
  if (r.status !== 0) {
    failed++
    console.log(`=== ${n} failed (exit ${r.status})`)
  }
}
process.exit(failed ? 1 : 0)
