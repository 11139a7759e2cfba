import { z } from 'zod'

/**
 * The only place that reads process.env. Validated once at start-up; a missing or malformed
 * variable stops the process with a list of what is wrong. Every variable is listed in
 * .env.example with a one-line comment.
 */
const envSchema = z.object({
  NODE_ENV: z.enum(['development', 'test', 'production']).default('development'),
  HOST: z.string().default('127.0.0.1'),
  PORT: z.coerce.number().int().min(0).max(65535).default(3000),
  PUBLIC_URL: z.string().url().optional(),
  TRUST_PROXY: z
    .enum(['0', '1', 'true', 'false'])
    .default('0')
    .transform((v) => v === '1' || v === 'true'),
  DB_HOST: z.string().default('127.0.0.1'),
  DB_PORT: z.coerce.number().int().min(1).max(65535).default(3307),
  DB_NAME: z
    .string()
    .regex(/^[A-Za-z0-9_]+$/)
    .default('trenchward'),
  DB_USER: z.string().min(1),
  DB_PASSWORD: z.string().min(1),
  DB_POOL_MAX: z.coerce.number().int().min(1).max(100).default(10),
  SESSION_SECRET: z.string().min(32),
  SESSION_MAX_AGE_H: z.coerce
    .number()
    .positive()
    .max(24 * 30)
    .default(12),
  SMTP_HOST: z.string().default('127.0.0.1'),
  SMTP_PORT: z.coerce.number().int().min(1).max(65535).default(2525),
  MAIL_FROM: z.string().default('Trenchward <no-reply@trenchward.invalid>'),
  MAIL_CATCH_DIR: z.string().optional(),
  /** Smallest influence distance of any activity, m (owners' protection strips are seldom less). */
  SCREENING_MIN_DISTANCE_M: z.coerce.number().min(0).max(100).default(5),
  PROJECTED_EPSG: z.coerce.number().int().positive().default(25832),
  CLIENT_DIST_DIR: z.string().optional(),
  DATA_DIR: z.string().optional(),
  /** Where uploaded import files are kept; default <DATA_DIR or .data>/uploads. */
  UPLOAD_DIR: z.string().optional(),
  /** Largest accepted import upload, in megabytes. */
  /** Largest document an applicant may attach, in megabytes. */
  ATTACHMENT_MAX_MB: z.coerce.number().positive().max(200).default(25),
  IMPORT_MAX_UPLOAD_MB: z.coerce.number().positive().max(4096).default(512),
  /**
   * The area pipes may lie in, as minLon,minLat,maxLon,maxLat (WGS84). A vertex outside it is
   * an import error: it catches swapped axes and data in the wrong CRS. The default frames the
   * demo town.
   */
  SERVICE_AREA_BBOX: z
    .string()
    .default('9.85,52.55,10.05,52.65')
    .transform((v, ctx) => {
      const n = v.split(',').map((p) => Number(p.trim()))
      const [minLon, minLat, maxLon, maxLat] = n
      const ok =
        n.length === 4 &&
        n.every(Number.isFinite) &&
        minLon! >= -180 &&
        maxLon! <= 180 &&
        minLat! >= -90 &&
        maxLat! <= 90 &&
        minLon! < maxLon! &&
        minLat! < maxLat!
      if (!ok) {
        ctx.addIssue({ code: 'custom', message: 'expected minLon,minLat,maxLon,maxLat in degrees' })
        return z.NEVER
      }
      return n as [number, number, number, number]
    }),
  /** Most features the public screening outline returns for one map view. */
  OUTLINE_MAX_FEATURES: z.coerce.number().int().min(1).max(100_000).default(5000),
  /** Most segments the owner's network map gets for one view (then it says `truncated`). */
  MAP_LINES_MAX_FEATURES: z.coerce.number().int().min(1).max(200_000).default(20_000),
  /** Working days an owner has to answer a review (weekends and PUBLIC_HOLIDAYS skipped). */
  REVIEW_PERIOD_WORKING_DAYS: z.coerce.number().int().min(1).max(260).default(10),
  /** Working days a touched owner has to answer a permit change request. */
  CHANGE_REVIEW_WORKING_DAYS: z.coerce.number().int().min(1).max(60).default(3),
  /** Hours within which the full application must follow emergency works. */
  EMERGENCY_FOLLOW_UP_H: z.coerce
    .number()
    .int()
    .min(1)
    .max(24 * 14)
    .default(48),
  /** Owners with a pipe this close to emergency works are alerted, m (at least the screening minimum). */
  EMERGENCY_ALERT_DISTANCE_M: z.coerce.number().min(1).max(500).default(25),
  /** Public holidays as a comma list of YYYY-MM-DD; they do not count as working days. */
  PUBLIC_HOLIDAYS: z
    .string()
    .default('')
    .transform((v, ctx) => {
      const days = v
        .split(',')
        .map((d) => d.trim())
        .filter(Boolean)
      const bad = days.find((d) => !/^\d{4}-\d{2}-\d{2}$/.test(d))
      if (bad) {
        ctx.addIssue({ code: 'custom', message: `expected YYYY-MM-DD dates, got ${bad}` })
        return z.NEVER
      }
      return days
    }),
  /** Owners get a reminder this many working days before a review is due (and on the day). */
  REMINDER_DAYS_BEFORE: z.coerce.number().int().min(0).max(30).default(2),
  /** How often the reminder scheduler looks for due reviews, in seconds. */
  REMINDER_INTERVAL_S: z.coerce.number().int().min(5).max(86_400).default(900),
  /** Permit-signing key folder (default <DATA_DIR or .data>/keys); keep it out of the repo. */
  KEY_DIR: z.string().optional(),
  /** Issued permit PDFs (default <DATA_DIR or .data>/permits). */
  PERMIT_DIR: z.string().optional(),
  /**
   * The street authority whose fee schedule prices applications. Unset: the street authority
   * with a schedule in force that has the lowest id (one authority per deployment).
   */
  FEE_AUTHORITY_ORGANISATION_ID: z.coerce.number().int().positive().optional(),
  /** Receipt PDFs (default <DATA_DIR or .data>/receipts). */
  RECEIPT_DIR: z.string().optional(),
  /** Largest PDF accepted by the public document check, in megabytes. */
  VERIFY_MAX_UPLOAD_MB: z.coerce.number().positive().max(100).default(20),
  /**
   * Payment service secret API key (no default). Without it the applicant cannot pay online;
   * fees are still computed and may be invoiced.
   */
  STRIPE_SECRET_KEY: z.string().min(8).optional(),
  /** Secret that signs the payment service's webhooks to /api/payments/webhook (no default). */
  STRIPE_WEBHOOK_SECRET: z.string().min(8).optional(),
  /**
   * Where the payment SDK sends its API calls. Unset: the real service. scripts/start and the
   * tests point them at the local fake payment server on loopback (scripts/fake-payments.ts).
   */
  STRIPE_API_HOST: z.string().optional(),
  STRIPE_API_PORT: z.coerce.number().int().min(1).max(65535).optional(),
  STRIPE_API_PROTOCOL: z.enum(['http', 'https']).optional(),
  LOG_LEVEL: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent']).default('info'),
  BCRYPT_COST: z.coerce.number().int().min(12).max(15).default(12),
  SIGN_IN_MAX_FAILURES: z.coerce.number().int().min(1).max(100).default(5),
  /** How long an e-mailed password-reset link stays good, in minutes. */
  PASSWORD_RESET_TTL_MIN: z.coerce
    .number()
    .int()
    .min(5)
    .max(24 * 60)
    .default(60),
  SIGN_IN_LOCK_MIN: z.coerce
    .number()
    .positive()
    .max(24 * 60)
    .default(15),
})

export type AppConfig = Readonly<z.infer<typeof envSchema>> & {
  readonly publicUrl: string
  /** Resolved upload folder (UPLOAD_DIR, else <DATA_DIR or .data>/uploads). */
  readonly uploadDir: string
  /** Resolved signing-key folder (KEY_DIR, else <DATA_DIR or .data>/keys). */
  readonly keyDir: string
  /** Resolved permit PDF folder (PERMIT_DIR, else <DATA_DIR or .data>/permits). */
  readonly permitDir: string
  /** Resolved receipt PDF folder (RECEIPT_DIR, else <DATA_DIR or .data>/receipts). */
  readonly receiptDir: string
  /** PUBLIC_HOLIDAYS as a set, for the working-day functions. */
  readonly publicHolidays: ReadonlySet<string>
}

/** Parse an environment; exported so tests can build a config without touching process.env. */
export function parseConfig(env: Record<string, string | undefined>): AppConfig {
  const parsed = envSchema.safeParse(env)
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`)
    throw new Error(`Invalid configuration:\n${lines.join('\n')}`)
  }
  const c = parsed.data
  return Object.freeze({
    ...c,
    publicUrl: c.PUBLIC_URL ?? `http://${c.HOST}:${c.PORT}`,
    uploadDir: c.UPLOAD_DIR ?? `${c.DATA_DIR ?? '.data'}/uploads`,
    keyDir: c.KEY_DIR ?? `${c.DATA_DIR ?? '.data'}/keys`,
    permitDir: c.PERMIT_DIR ?? `${c.DATA_DIR ?? '.data'}/permits`,
    receiptDir: c.RECEIPT_DIR ?? `${c.DATA_DIR ?? '.data'}/receipts`,
    publicHolidays: new Set(c.PUBLIC_HOLIDAYS),
  })
}

let current: AppConfig | undefined

/** The process-wide configuration, read from process.env on first use. */
export function config(): AppConfig {
  current ??= parseConfig(process.env)
  return current
}

/** Replace the process-wide configuration (tests and scripts that set up their own). */
export function setConfig(next: AppConfig): void {
  current = next
}
