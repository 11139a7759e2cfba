/**
 * Database migrations from the command line: node --import tsx scripts/migrate.ts up|down|status
 * (down reverts the last migration; `down all` reverts every one). Reads the same environment
 * as the server.
 */
import { config } from '../server/config.ts'
import { createMigrator } from '../server/db/migrate.ts'
import { createSequelize } from '../server/db/sequelize.ts'

const [command = 'up', arg] = process.argv.slice(2)
const cfg = config()
const sequelize = createSequelize(cfg)
const migrator = createMigrator(sequelize, cfg.PROJECTED_EPSG)
try {
  if (command === 'up') {
    const done = await migrator.up()
    console.error(
      `[migrate] ${done.length ? `applied ${done.map((m) => m.name).join(', ')}` : 'schema is up to date'}`,
    )
  } else if (command === 'down') {
    const done = await migrator.down(arg === 'all' ? { to: 0 } : undefined)
    console.error(`[migrate] reverted ${done.map((m) => m.name).join(', ') || 'nothing'}`)
  } else if (command === 'status') {
    const executed = await migrator.executed()
    const pending = await migrator.pending()
    console.log(
      JSON.stringify(
        { executed: executed.map((m) => m.name), pending: pending.map((m) => m.name) },
        null,
        2,
      ),
    )
  } else {
    console.error('usage: migrate.ts up|down [all]|status')
    process.exitCode = 2
  }
} finally {
  await sequelize.close()
}
