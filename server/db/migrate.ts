import { readdirSync } from 'node:fs'
import { fileURLToPath, pathToFileURL } from 'node:url'
import { dirname, join } from 'node:path'
import { Umzug, SequelizeStorage } from 'umzug'
import type { QueryInterface, Sequelize } from 'sequelize'

/** What every migration receives. */
export interface MigrationContext {
  queryInterface: QueryInterface
  sequelize: Sequelize
  /** EPSG code of the projected metric CRS all geometry columns use. */
  projectedEpsg: number
}

export interface Migration {
  up(ctx: MigrationContext): Promise<void>
  down(ctx: MigrationContext): Promise<void>
}

const MIGRATIONS_DIR = join(dirname(fileURLToPath(import.meta.url)), 'migrations')

/**
 * Umzug over the files in server/db/migrations (YYYYMMDDHHmm-verb-object.ts, run in name
 * order), recorded in the `schema_migrations` table.
 */
export function createMigrator(sequelize: Sequelize, projectedEpsg: number) {
  const files = readdirSync(MIGRATIONS_DIR)
    .filter((f) => /^\d{12}-[a-z0-9-]+\.ts$/.test(f))
    .sort()
  return new Umzug<MigrationContext>({
    migrations: files.map((file) => ({
      name: file.replace(/\.ts$/, ''),
      async up({ context }) {
        const m = (await import(pathToFileURL(join(MIGRATIONS_DIR, file)).href)) as Migration
        await m.up(context)
      },
      async down({ context }) {
        const m = (await import(pathToFileURL(join(MIGRATIONS_DIR, file)).href)) as Migration
        await m.down(context)
      },
    })),
    context: { queryInterface: sequelize.getQueryInterface(), sequelize, projectedEpsg },
    storage: new SequelizeStorage({ sequelize, tableName: 'schema_migrations' }),
    logger: undefined,
  })
}
