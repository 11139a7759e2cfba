import pino from 'pino'

/**
 * Structured JSON logs (one line per event). Passwords, password hashes, reset tokens, cookies
 * and session ids are redacted wherever they appear in a logged object, and so are the SQL text
 * and bound values a database error carries (they can hold any of those). The level is set once
 * from the configuration.
 */
export const logger = pino({
  level: 'info',
  redact: {
    paths: [
      'password',
      '*.password',
      'req.headers.cookie',
      'req.headers.authorization',
      'req.headers["x-csrf-token"]',
      'res.headers["set-cookie"]',
      'sid',
      '*.sid',
      'token',
      '*.token',
      'passwordHash',
      '*.passwordHash',
      '*.password_hash',
      'req.headers["set-cookie"]',
      'err.sql',
      'err.parameters',
      'err.original.sql',
      'err.original.parameters',
      'err.parent.sql',
      'err.parent.parameters',
      'err.original.text',
    ],
    censor: '[redacted]',
  },
})

export function setLogLevel(level: string): void {
  logger.level = level
}

const SECRET_QUERY = /([?&](?:token|password|sid)=)[^&#]*/gi

/** A request URL as logged: values of secret-looking query parameters replaced. */
export const loggableUrl = (url: string) => url.replace(SECRET_QUERY, '$1[redacted]')
