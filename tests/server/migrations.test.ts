import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { inject } from 'vitest'
import { QueryTypes } from 'sequelize'
import { parseConfig } from '../../server/config.ts'
import { createMigrator } from '../../server/db/migrate.ts'
import { createSequelize } from '../../server/db/sequelize.ts'

// A scratch database of its own, so reverting every migration cannot disturb other tests.
const cfg = parseConfig({ ...inject('testEnv'), DB_NAME: 'trenchward_migrations' })
const sequelize = createSequelize(cfg)
const migrator = createMigrator(sequelize, cfg.PROJECTED_EPSG)

const tables = async () =>
  (
    await sequelize.query<{ t: string }>(
      "SELECT table_name AS t FROM information_schema.tables WHERE table_schema = DATABASE() AND table_name <> 'schema_migrations' ORDER BY table_name",
      { type: QueryTypes.SELECT },
    )
  ).map((r) => r.t)

beforeAll(async () => {
  await migrator.down({ to: 0 })
})
afterAll(async () => {
  await sequelize.close()
})

describe('migrations', () => {
  it('go all the way up, all the way down, and up again', async () => {
    const all = (await migrator.pending()).map((m) => m.name)
    expect(all.length).toBeGreaterThan(0)
    await migrator.up()
    expect(await migrator.pending()).toEqual([])
    const up = await tables()
    expect(up).toEqual(
      expect.arrayContaining(['organisations', 'users', 'sessions', 'audit_events', 'streets']),
    )
    await migrator.down({ to: 0 })
    expect(await tables()).toEqual([])
    await migrator.up()
    expect(await tables()).toEqual(up)
  })

  it('store street geometry with the configured SRID and a spatial index', async () => {
    await migrator.up()
    const srid = await sequelize.query<{ srid: number }>(
      "SELECT SRID AS srid FROM information_schema.GEOMETRY_COLUMNS WHERE G_TABLE_SCHEMA = DATABASE() AND G_TABLE_NAME = 'streets'",
      { type: QueryTypes.SELECT },
    )
    expect(srid[0]?.srid).toBe(25832)
    const idx = await sequelize.query<{ Index_type: string }>(
      "SHOW INDEX FROM streets WHERE Key_name = 'streets_geom'",
      {
        type: QueryTypes.SELECT,
      },
    )
    expect(idx[0]?.Index_type).toBe('SPATIAL')
  })
})
