import session from 'express-session'
import connectSessionSequelize from 'connect-session-sequelize'
import { QueryTypes } from 'sequelize'
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
  // The store's own get() returns a row whatever its `expires`; the periodic clean-up runs only
  // every 15 minutes. A session past its expiry is refused (and removed) here, so the idle
  // lifetime holds to the second even for a client that keeps an old cookie.
  const storedGet = store.get.bind(store)
  store.get = (sid, callback) => {
    sequelize
      .query<{ expires: Date | null }>('SELECT expires FROM sessions WHERE sid = ?', {
        replacements: [sid],
        type: QueryTypes.SELECT,
      })
      .then(([row]) => {
        if (!row) return callback(null, null)
        if (row.expires && new Date(row.expires).getTime() <= Date.now())
          return store.destroy(sid, () => callback(null, null))
        storedGet(sid, callback)
      }, callback)
  }
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
