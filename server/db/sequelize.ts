import { Sequelize } from 'sequelize'
import type { AppConfig } from '../config.ts'

/**
 * One Sequelize instance per process, on the mariadb driver (pinned to 3.0.x: newer drivers
 * break Sequelize 6 raw queries). Times are stored in UTC.
 */
export function createSequelize(cfg: AppConfig): Sequelize {
  return new Sequelize(cfg.DB_NAME, cfg.DB_USER, cfg.DB_PASSWORD, {
    host: cfg.DB_HOST,
    port: cfg.DB_PORT,
    dialect: 'mariadb',
    logging: false,
    timezone: '+00:00',
    dialectOptions: { connectTimeout: 5_000 },
    pool: { max: cfg.DB_POOL_MAX, min: 0, idle: 10_000, acquire: 10_000 },
    define: { underscored: true },
  })
}
