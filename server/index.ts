import { createServer } from 'node:http'
import { createApp } from './app.ts'
import { config } from './config.ts'
import { createSequelize } from './db/sequelize.ts'
import { createMigrator } from './db/migrate.ts'
import { logger, setLogLevel } from './logger.ts'
import { startOutboxWorker } from './mail/outbox-worker.ts'
import { startScheduler } from './jobs/scheduler.ts'
import { failInterruptedImports } from './services/import/import-jobs.ts'

/**
 * The API and client server process. Runs pending migrations, then listens. SIGINT/SIGTERM close
 * the listener and the database pool.
 */
async function main(): Promise<void> {
  const cfg = config()
  setLogLevel(cfg.LOG_LEVEL)
  const sequelize = createSequelize(cfg)
  await createMigrator(sequelize, cfg.PROJECTED_EPSG).up()
  const { app, close } = createApp(cfg, sequelize)
  const interrupted = await failInterruptedImports()
  if (interrupted)
    logger.warn({ interrupted }, 'network imports cut off by the last stop were marked failed')
  const stopOutbox = startOutboxWorker(sequelize, cfg)
  const stopScheduler = startScheduler(sequelize, cfg)
  const server = createServer(app)
  server.listen(cfg.PORT, cfg.HOST, () => {
    logger.info({ url: cfg.publicUrl }, 'Trenchward is listening')
  })
  const stop = () => {
    logger.info('shutting down')
    server.close(() => {
      stopOutbox()
      stopScheduler()
      close()
      sequelize.close().finally(() => process.exit(0))
    })
    setTimeout(() => process.exit(0), 5_000).unref()
  }
  process.on('SIGINT', stop)
  process.on('SIGTERM', stop)
}

main().catch((err: unknown) => {
  logger.fatal({ err }, 'could not start')
  process.exit(1)
})
