/**
 * Benchmark of the statics engine: assessments per second on one core for two realistic inputs
 * (a crane on four outrigger mats plus an excavation and a fill beside a PE water main; a
 * stockpile and a deep excavation beside a concrete sewer). Warm-up, then N timed rounds, and the
 * median rate is reported, per core (from the process's CPU time, so other load on the machine
 * does not halve the figure) and by wall clock. It reports; it does not gate (target: at least
 * 20 000 per second per core).
 * Usage: node --import tsx scripts/bench/engine.ts [rounds]
 */
import { performance } from 'node:perf_hooks'
import { cpuUsage } from 'node:process'
import { assessPipe, type AssessmentInput } from '../../shared/statics/index.ts'

const TARGET_PER_S = 20_000
const WARM_UP_RUNS = 2_000
const RUNS_PER_ROUND = 2_000
const ROUNDS = Number(process.argv[2] ?? 15)

const peMain: AssessmentInput = {
  pipe: {
    material: 'PE100',
    outerDiameter_m: 0.4,
    wallThickness_m: 0.0364,
    internalPressure_kPa: 600,
    cover_m: 1.5,
    installation: 'trench',
    trenchWidth_m: 0.9,
    wallFrictionKMu: 0.165,
    backfillUnitWeight_kN_per_m3: 19,
    frictionAngle_deg: 30,
    sidefillModulus_MPa: 5,
    beddingAngle_deg: 90,
    groundwaterAboveCrown_m: 0,
    designTrafficPressure_kPa: 10,
  },
  activities: [
    {
      id: 'mat-front-left',
      kind: 'pad',
      load_kN: 280,
      footprint: { xMin_m: 1.6, xMax_m: 2.8, yMin_m: -3.6, yMax_m: -2.4 },
    },
    {
      id: 'mat-front-right',
      kind: 'pad',
      load_kN: 240,
      footprint: { xMin_m: 1.6, xMax_m: 2.8, yMin_m: 2.4, yMax_m: 3.6 },
    },
    {
      id: 'mat-rear-left',
      kind: 'pad',
      load_kN: 180,
      footprint: { xMin_m: 8.6, xMax_m: 9.8, yMin_m: -3.6, yMax_m: -2.4 },
    },
    {
      id: 'mat-rear-right',
      kind: 'pad',
      load_kN: 160,
      footprint: { xMin_m: 8.6, xMax_m: 9.8, yMin_m: 2.4, yMax_m: 3.6 },
    },
    {
      id: 'pit',
      kind: 'excavation',
      depth_m: 2.5,
      support: 'trench-box',
      footprint: { xMin_m: -3.0, xMax_m: -1.2, yMin_m: 6, yMax_m: 10 },
    },
    {
      id: 'spoil',
      kind: 'fill',
      height_m: 1.5,
      unitWeight_kN_per_m3: 18,
      footprint: {
        polygon_m: [
          [-9, -6],
          [-5, -6],
          [-4, 0],
          [-5, 5],
          [-9, 5],
        ],
      },
    },
  ],
}

const concreteSewer: AssessmentInput = {
  pipe: {
    material: 'concrete',
    outerDiameter_m: 0.75,
    wallThickness_m: 0.075,
    crushingStrength_kN_per_m: 90,
    beddingFactor: 1.9,
    internalPressure_kPa: 0,
    cover_m: 2.5,
    installation: 'trench',
    trenchWidth_m: 1.4,
    wallFrictionKMu: 0.13,
    backfillUnitWeight_kN_per_m3: 20,
    frictionAngle_deg: 25,
    sidefillModulus_MPa: 3,
    beddingAngle_deg: 120,
    groundwaterAboveCrown_m: 0,
    designTrafficPressure_kPa: 15,
  },
  activities: [
    {
      id: 'heap',
      kind: 'area',
      pressure_kPa: 30,
      footprint: { xMin_m: 3, xMax_m: 8, yMin_m: -5, yMax_m: 5 },
    },
    {
      id: 'basement',
      kind: 'excavation',
      depth_m: 4,
      support: 'sheet-piling',
      footprint: { xMin_m: -14, xMax_m: -4, yMin_m: -10, yMax_m: 10 },
    },
  ],
}

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b)
  const mid = Math.floor(sorted.length / 2)
  return sorted.length % 2 === 1
    ? (sorted[mid] as number)
    : ((sorted[mid - 1] as number) + (sorted[mid] as number)) / 2
}

function bench(name: string, input: AssessmentInput): void {
  let sink = 0
  for (let i = 0; i < WARM_UP_RUNS; i++) sink += assessPipe(input).checks.length
  const cpuRates: number[] = []
  const wallRates: number[] = []
  for (let round = 0; round < ROUNDS; round++) {
    const cpuStart = cpuUsage()
    const wallStart = performance.now()
    for (let i = 0; i < RUNS_PER_ROUND; i++) sink += assessPipe(input).checks.length
    const wall_s = (performance.now() - wallStart) / 1000
    const cpu = cpuUsage(cpuStart)
    const cpu_s = (cpu.user + cpu.system) / 1e6
    cpuRates.push(RUNS_PER_ROUND / cpu_s)
    wallRates.push(RUNS_PER_ROUND / wall_s)
  }
  const rate = median(cpuRates)
  const wallRate = median(wallRates)
  const verdict = assessPipe(input).verdict
  const mark = rate >= TARGET_PER_S ? 'meets' : 'BELOW'
  const format = (value: number): string => Math.round(value).toLocaleString('en-GB').padStart(9)
  console.log(
    `${name.padEnd(36)} ${format(rate)} assessments/s per core (wall clock ${format(wallRate).trim()}/s; ` +
      `median of ${ROUNDS} × ${RUNS_PER_ROUND}; verdict ${verdict}; ${mark} the ${TARGET_PER_S.toLocaleString('en-GB')}/s target)`,
  )
  if (sink < 0) console.log('unreachable')
}

bench('crane + pit + spoil beside PE main', peMain)
bench('heap + basement beside concrete', concreteSewer)
