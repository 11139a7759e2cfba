import session from 'express-session'
import connectSessionSequelize from 'connect-session-sequelize'
import type { Sequelize } from 'sequelize'
import type { AppConfig } from '../config.ts'

export const SESSION_COOKIE = 'tw.sid'

/**
 * express-session with its store in MariaDB (the `sessions` table, created by a migration), so
 * several app processes share sessions. Cookies are httpOnly and SameSite=Lax, and Secure when
 * the request arrived over TLS (behind a proxy: set TRUST_PROXY).
 */
export function createSessionMiddleware(cfg: AppConfig, sequelize: Sequelize) {
  const SequelizeStore = connectSessionSequelize(session.Store)
  const maxAge_ms = cfg.SESSION_MAX_AGE_H * 3_600_000
  const store = new SequelizeStore({
    db: sequelize,
    tableName: 'sessions',
    checkExpirationInterval: 15 * 60_000,
    expiration: maxAge_ms,
  })
  const middleware = session({
    name: SESSION_COOKIE,
    secret: cfg.SESSION_SECRET,
    store,
    resave: false,
    saveUninitialized: false,
    rolling: true,
    proxy: cfg.TRUST_PROXY,
    cookie: {
      httpOnly: true,
      sameSite: 'lax',
      secure: cfg.TRUST_PROXY ? 'auto' : false,
      maxAge: maxAge_ms,
    },
  })
  return { middleware, store }
}
