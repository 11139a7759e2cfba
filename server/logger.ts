import pino from 'pino'

/**
 * Structured JSON logs (one line per event). Passwords, cookies and session ids are redacted
 * wherever they appear in a logged object. The level is set once from the configuration.
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
    ],
    censor: '[redacted]',
  },
})

export function setLogLevel(level: string): void {
  logger.level = level
}
