/**
 * Screening at city scale: one application with three activities (a pit across the street, a
 * crane pad, a stockpile) at the centre of the synthetic city (synthetic-network.ts), submitted
 * through the real service (spatial query, pipe-local frames, engine, combined screening, owner
 * reviews, writes) at each network size, beside two floors measured in the same run: a bare
 * primary-key lookup of one segment and the spatial candidate query alone. Prints EXPLAIN of the
 * spatial query to show the index is used. Sizes whose database is not loaded are loaded first
 * (that takes minutes for 1,000,000). It reports; it does not gate.
 * Targets: submit p95 < 100 ms at 1,000,000 segments; spatial query < 3 × the key lookup.
 * Usage: node --import tsx scripts/bench/screening-scale.ts [runs=40] [sizes=10000,100000,1000000]
 */
import { QueryTypes } from 'sequelize'
import { withdrawApplication } from '../../server/services/applications.ts'
import { findSegmentsNear, segmentsNearQuery } from '../../server/services/spatial-query.ts'
import { crsTransform } from '../../shared/geo/crs.ts'
import { benchUsers, openCity, submitCentreApplication } from './bench-city.ts'
import { fmt, machineLoad, percentile, printTable, ratio, timeRuns } from './bench-util.ts'
import { centreActivities } from './screening-scale-activities.ts'

const RUNS = Number(process.argv[2] ?? 40) || 40
const SIZES = (process.argv[3] ?? '10000,100000,1000000').split(',').map(Number)
const WARM_UP = 5

interface SizeResult {
  n: number
  pk: number[]
  spatial: number[]
  spatialSql: number[]
  submit: number[]
  found: number
  affected: number
  explain: string
}

async function benchSize(n: number): Promise<SizeResult> {
  const { cfg, sequelize } = await openCity(n)
  try {
    const { applicant } = await benchUsers(sequelize)
    const activities = centreActivities(cfg.PROJECTED_EPSG)
    const t = crsTransform(cfg.PROJECTED_EPSG)
    const pitRing = (activities[0]!.geometry as { coordinates: number[][][] }).coordinates[0]!.map(
      (p) => t.toGrid(p),
    )
    const pit = { type: 'Polygon' as const, rings: [pitRing] }
    const [{ maxId }] = (await sequelize.query<{ maxId: number }>(
      'SELECT MAX(id) AS maxId FROM pipe_segments',
      { type: QueryTypes.SELECT },
    )) as [{ maxId: number }]

    // Floor: a bare primary-key lookup of one (random) segment row.
    const pk = await timeRuns(RUNS, WARM_UP, (i) =>
      sequelize.query('SELECT * FROM pipe_segments WHERE id = ?', {
        replacements: [1 + ((Math.abs(i) * 7919) % maxId)],
        type: QueryTypes.SELECT,
      }),
    )
    // The spatial candidate query alone (the pit, 5 m influence), with exact distances.
    let found = 0
    const spatial = await timeRuns(RUNS, WARM_UP, async () => {
      found = (await findSegmentsNear(sequelize, cfg.PROJECTED_EPSG, pit, 5)).length
    })
    const q = segmentsNearQuery(cfg.PROJECTED_EPSG, pit, 5)
    // The candidate statement by itself: one round trip, like the key lookup.
    const spatialSql = await timeRuns(RUNS, WARM_UP, () =>
      sequelize.query(q.sql, { replacements: q.replacements, type: QueryTypes.SELECT }),
    )
    const plan = await sequelize.query<Record<string, unknown>>(`EXPLAIN ${q.sql}`, {
      replacements: q.replacements,
      type: QueryTypes.SELECT,
    })
    const explain = plan
      .map((r) => `type=${r.type} key=${r.key} rows=${r.rows} Extra=${r.Extra}`)
      .join('; ')

    // End to end: submit (screening and everything else submit does), then withdraw (untimed)
    // so the next run sees the same live works.
    let affected = 0
    const submit = await timeRuns(RUNS, WARM_UP, async (i) => {
      const { draft, submit: run } = await submitCentreApplication(
        sequelize,
        cfg,
        applicant,
        `Bench screening ${n} ${i}`,
      )
      const t0 = process.hrtime.bigint()
      const done = await run()
      const ms = Number(process.hrtime.bigint() - t0) / 1e6
      const [{ k }] = (await sequelize.query<{ k: number }>(
        'SELECT COUNT(*) AS k FROM assessments WHERE application_id = ?',
        { replacements: [draft.id], type: QueryTypes.SELECT },
      )) as [{ k: number }]
      affected = Number(k)
      await withdrawApplication(sequelize, applicant, done.id, 'Benchmark run')
      return ms
    })
    return { n, pk, spatial, spatialSql, submit, found, affected, explain }
  } finally {
    await sequelize.close()
  }
}

const results: SizeResult[] = []
for (const n of SIZES) results.push(await benchSize(n))

printTable(
  `Screening one application (3 activities), ${RUNS} runs per size; ${machineLoad()}`,
  [
    'segments',
    'PK lookup p50 ms',
    'spatial SQL p50 ms',
    'SQL / PK',
    'spatial query p50 ms',
    'query / PK',
    'submit p50 ms',
    'submit p95 ms',
    'submit p95 / PK p50',
    'candidates',
    'assessed',
  ],
  results.map((r) => {
    const pk50 = percentile(r.pk, 50)
    return [
      r.n.toLocaleString('en'),
      fmt(pk50, 2),
      fmt(percentile(r.spatialSql, 50), 2),
      ratio(percentile(r.spatialSql, 50), pk50),
      fmt(percentile(r.spatial, 50), 2),
      ratio(percentile(r.spatial, 50), pk50),
      fmt(percentile(r.submit, 50)),
      fmt(percentile(r.submit, 95)),
      ratio(percentile(r.submit, 95), pk50),
      r.found,
      r.affected,
    ]
  }),
)
console.log('\nEXPLAIN of the spatial candidate query:')
for (const r of results) console.log(`  ${r.n.toLocaleString('en').padStart(9)}: ${r.explain}`)
const last = results[results.length - 1]!
console.log(
  `\ntargets: submit p95 < 100 ms at ${last.n.toLocaleString('en')} (${fmt(percentile(last.submit, 95))} ms); ` +
    `spatial < 3 × PK (statement ${ratio(percentile(last.spatialSql, 50), percentile(last.pk, 50))}, ` +
    `with exact distances and owner names ${ratio(percentile(last.spatial, 50), percentile(last.pk, 50))})`,
)
