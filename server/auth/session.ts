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
/** A session's expiry is pushed out in the database at most this often per process, ms. */
export const TOUCH_INTERVAL_MS = 60_000

/**
 * rolling: true makes express-session touch the store on every request, an UPDATE of the
 * sessions row per API call. Skipping touches of a session this process touched less than
 * TOUCH_INTERVAL_MS ago costs at most that much of its lifetime (hours) and saves the write on
 * all but one request a minute. Sessions that change are still saved in full by express-session.
 */
function throttleTouches(store: session.Store): void {
  const original = store.touch?.bind(store)
  if (!original) return
  const touched = new Map<string, number>()
  store.touch = (sid, data, callback) => {
    const now = Date.now()
    const last = touched.get(sid)
    if (last !== undefined && now - last < TOUCH_INTERVAL_MS) return callback?.()
    if (touched.size > 50_000) touched.clear()
    touched.set(sid, now)
    original(sid, data, callback)
  }
}

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
  throttleTouches(store)
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
