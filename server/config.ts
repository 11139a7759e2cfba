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
  PROJECTED_EPSG: z.coerce.number().int().positive().default(25832),
  CLIENT_DIST_DIR: z.string().optional(),
  DATA_DIR: z.string().optional(),
  LOG_LEVEL: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent']).default('info'),
  BCRYPT_COST: z.coerce.number().int().min(12).max(15).default(12),
  SIGN_IN_MAX_FAILURES: z.coerce.number().int().min(1).max(100).default(5),
  SIGN_IN_LOCK_MIN: z.coerce
    .number()
    .positive()
    .max(24 * 60)
    .default(15),
})

export type AppConfig = Readonly<z.infer<typeof envSchema>> & { readonly publicUrl: string }

/** Parse an environment; exported so tests can build a config without touching process.env. */
export function parseConfig(env: Record<string, string | undefined>): AppConfig {
  const parsed = envSchema.safeParse(env)
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`)
    throw new Error(`Invalid configuration:\n${lines.join('\n')}`)
  }
  const c = parsed.data
  return Object.freeze({ ...c, publicUrl: c.PUBLIC_URL ?? `http://${c.HOST}:${c.PORT}` })
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
