import type { TestProject } from 'vitest/node'
import { parseConfig } from '../../server/config.ts'
import { createMigrator } from '../../server/db/migrate.ts'
import { createSequelize } from '../../server/db/sequelize.ts'
import { ensureDatabase, testEnv } from '../helpers/local-env.ts'

export const TEST_DB = 'trenchward_test'

/**
 * Once per run: the private MariaDB is up (started when needed, left running), the test
 * database exists and carries the current schema through the real migrations.
 */
export default async function setup(project: TestProject): Promise<void> {
  ensureDatabase(TEST_DB, 'trenchward_migrations')
  const env = testEnv(TEST_DB)
  const cfg = parseConfig(env)
  const sequelize = createSequelize(cfg)
  try {
    await createMigrator(sequelize, cfg.PROJECTED_EPSG).up()
  } finally {
    await sequelize.close()
  }
  project.provide('testEnv', env)
}
