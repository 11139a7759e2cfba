import type { Sequelize } from 'sequelize'
import type { AppConfig } from '../config.ts'
import { logger } from '../logger.ts'
import { sendAttendanceNoticesOnce } from '../services/attendance-notices.ts'
import { expirePermitsOnce } from '../services/permit-expiry.ts'
import { runRemindersOnce } from '../services/review-reminders.ts'

/**
 * The in-process scheduler: every REMINDER_INTERVAL_S it sends due review reminders, marks
 * expired permits and sends planned-start notices to owners who attend. Safe with several app processes (both jobs claim their work in the
 * database). Returns a function that stops it.
 */
export function startScheduler(sequelize: Sequelize, cfg: AppConfig): () => void {
  let running = false
  const tick = () => {
    if (running) return
    running = true
    Promise.all([
      runRemindersOnce(sequelize, cfg),
      expirePermitsOnce(sequelize),
      sendAttendanceNoticesOnce(sequelize, cfg),
    ])
      .then(([reminders, expired, startNotices]) => {
        if (reminders || expired || startNotices)
          logger.info({ reminders, expired, startNotices }, 'scheduler run')
      })
      .catch((err: unknown) => logger.error({ err }, 'scheduler run failed'))
      .finally(() => {
        running = false
      })
  }
  const timer = setInterval(tick, cfg.REMINDER_INTERVAL_S * 1000)
  timer.unref()
  setTimeout(tick, 10_000).unref()
  return () => clearInterval(timer)
}
