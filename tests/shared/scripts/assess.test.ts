import { describe, it, expect } from 'vitest'
import { spawnSync } from 'node:child_process'
import { fileURLToPath } from 'node:url'
import { tmpdir } from 'node:os'

// The CLI must work right after `npm ci` and from any working directory (issue 3).
const cli = fileURLToPath(new URL('../../../scripts/assess', import.meta.url))
const run = (stdin: string) =>
  spawnSync(cli, [], { input: stdin, cwd: tmpdir(), encoding: 'utf8', timeout: 60_000 })

const input = {
  pipe: {
    material: 'PE100',
    outerDiameter_m: 0.4,
    wallThickness_m: 0.024,
    internalPressure_kPa: 600,
    cover_m: 1.8,
    installation: 'trench',
    trenchWidth_m: 1.0,
    wallFrictionKMu: 0.165,
    backfillUnitWeight_kN_per_m3: 19,
    frictionAngle_deg: 30,
    sidefillModulus_MPa: 5,
    beddingAngle_deg: 90,
    groundwaterAboveCrown_m: 0,
    designTrafficPressure_kPa: 0,
  },
  activities: [
    {
      id: 'pad-1',
      kind: 'pad',
      load_kN: 300,
      footprint: { xMin_m: 1.5, xMax_m: 2.5, yMin_m: -0.5, yMax_m: 0.5 },
    },
  ],
}

describe('scripts/assess', () => {
  it('prints the assessment as JSON and exits 0 for good input', () => {
    const result = run(JSON.stringify(input))
    expect(result.status).toBe(0)
    const output = JSON.parse(result.stdout) as {
      verdict: string
      checks: unknown[]
      cautions: string[]
    }
    expect(['clear', 'conditional', 'critical']).toContain(output.verdict)
    expect(output.checks.length).toBeGreaterThan(0)
    expect(output.cautions.length).toBeGreaterThan(0)
  })

  it('exits 2 and names the field for invalid input, without a stack trace', () => {
    const result = run(JSON.stringify({ ...input, pipe: { ...input.pipe, cover_m: -3 } }))
    expect(result.status).toBe(2)
    expect(result.stdout).toBe('')
    expect(result.stderr).toMatch(/^pipe\.cover_m: /m)
    expect(result.stderr).not.toMatch(/\n\s+at \S+/)
  })

  it('exits 2 for text that is not JSON', () => {
    const result = run('{not json')
    expect(result.status).toBe(2)
    expect(result.stderr).toMatch(/^input: not valid JSON/)
  })
})
