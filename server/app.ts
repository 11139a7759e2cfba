import { randomUUID } from 'node:crypto'
import { existsSync } from 'node:fs'
import { join, resolve } from 'node:path'
import express from 'express'
import type { Request } from 'express'
import helmet from 'helmet'
import { pinoHttp } from 'pino-http'
import type { Sequelize } from 'sequelize'
import { configurePassport } from './auth/passport.ts'
import { createSessionMiddleware } from './auth/session.ts'
import type { AppConfig } from './config.ts'
import { loggableUrl, logger, setLogLevel } from './logger.ts'
import { allow } from './middleware/access.ts'
import { textCompression } from './middleware/compression.ts'
import { requireClientHeader } from './middleware/csrf.ts'
import { apiNotFound, errorHandler } from './middleware/error-handler.ts'
import { initModels } from './models/index.ts'
import { adminRouter } from './routes/admin.ts'
import { applicationsRouter } from './routes/applications.ts'
import { attachmentsRouter } from './routes/attachments.ts'
import { authRouter } from './routes/auth.ts'
import { homeRouter } from './routes/home.ts'
import { mapRouter } from './routes/map.ts'
import { networkRouter } from './routes/network.ts'
import { applicationReviewsRouter } from './routes/application-reviews.ts'
import { conditionTemplatesRouter } from './routes/condition-templates.ts'
import { coordinationRouter } from './routes/coordination.ts'
import { feeSchedulesRouter } from './routes/fee-schedules.ts'
import { feesRouter } from './routes/fees.ts'
import { paymentWebhookRouter } from './routes/payment-webhook.ts'
import { permitOfficeRouter } from './routes/permit-office.ts'
import { permitsRouter } from './routes/permits.ts'
import { reviewsRouter } from './routes/reviews.ts'
import { emergencyWorksRouter } from './routes/emergency-works.ts'
import { changeRequestsRouter } from './routes/permit-change-requests.ts'
import { siteWorksRouter } from './routes/site-works.ts'
import { verifyRouter } from './routes/verify.ts'

export interface CreatedApp {
  app: express.Express
  /** Stop timers the app owns (session expiry). Does not close the database. */
  close(): void
}

/**
 * The Express application without listen(): tests mount it on port 0, scripts/start on the
 * configured port. Routes are thin; the work is in services/.
 */
export function createApp(cfg: AppConfig, sequelize: Sequelize): CreatedApp {
  initModels(sequelize)
  setLogLevel(cfg.LOG_LEVEL)
  const app = express()
  app.disable('x-powered-by')
  app.set('trust proxy', cfg.TRUST_PROXY ? 1 : false)

  app.use(
    pinoHttp({
      logger,
      genReqId: (req, res) => {
        const id = randomUUID()
        res.setHeader('X-Request-Id', id)
        return id
      },
      autoLogging: { ignore: (req) => !(req.url ?? '').startsWith('/api') },
      serializers: {
        req: (req: { id: string; method: string; url: string }) => ({
          id: req.id,
          method: req.method,
          url: loggableUrl(req.url),
        }),
      },
    }),
  )

  app.use(
    helmet({
      contentSecurityPolicy: {
        useDefaults: false,
        directives: {
          'default-src': ["'self'"],
          'script-src': ["'self'"],
          // Quasar sets style attributes at run time.
          'style-src': ["'self'", "'unsafe-inline'"],
          'img-src': ["'self'", 'data:', 'blob:'],
          'font-src': ["'self'", 'data:'],
          'connect-src': ["'self'"],
          'worker-src': ["'self'", 'blob:'],
          'frame-src': ["'self'"],
          'frame-ancestors': ["'none'"],
          'form-action': ["'self'"],
          'base-uri': ["'self'"],
          'object-src': ["'none'"],
        },
      },
      crossOriginEmbedderPolicy: false,
    }),
  )

  // gzip for text (JSON, HTML, JS, CSS, SVG); PDFs, images and archives are compressed already.
  app.use(textCompression())

  const { middleware: sessionMiddleware, store } = createSessionMiddleware(cfg, sequelize)
  const passport = configurePassport()

  // The payment service's webhook needs the raw body for its signature: before express.json.
  app.use('/api/payments/webhook', paymentWebhookRouter(sequelize))

  const api = express.Router()
  api.use(express.json({ limit: '1mb' }))
  api.use(requireClientHeader)
  api.use(sessionMiddleware)
  api.use(passport.initialize())
  api.use(passport.session())
  api.get('/health', allow('public'), async (_req, res) => {
    await sequelize.query('SELECT 1')
    res.json({ ok: true })
  })
  api.use('/auth', authRouter)
  api.use('/home', homeRouter)
  api.use('/admin', adminRouter)
  api.use('/applications/:id/attachments', attachmentsRouter)
  api.use('/applications', applicationsRouter(sequelize))
  api.use('/applications', applicationReviewsRouter(sequelize))
  api.use('/reviews', reviewsRouter(sequelize))
  api.use('/condition-templates', conditionTemplatesRouter)
  api.use('/permit-office', permitOfficeRouter(sequelize))
  api.use('/permits', permitsRouter(sequelize))
  api.use('/coordination', coordinationRouter(sequelize))
  api.use('/site-works', siteWorksRouter(sequelize))
  api.use('/change-requests', changeRequestsRouter(sequelize))
  api.use('/emergency-works', emergencyWorksRouter(sequelize))
  api.use('/verify', verifyRouter)
  api.use('/fee-schedules', feeSchedulesRouter)
  api.use(feesRouter(sequelize))
  api.use(mapRouter(sequelize))
  api.use('/network', networkRouter(sequelize))
  api.use(apiNotFound)
  app.use('/api', api)

  const clientDir = resolve(cfg.CLIENT_DIST_DIR ?? join(process.cwd(), 'dist', 'client'))
  if (existsSync(join(clientDir, 'index.html'))) {
    app.use(express.static(clientDir, { index: false, maxAge: '1h' }))
    // History-mode routes of the client all get index.html.
    app.get(/^\/(?!api\/).*/, (req: Request, res) => {
      res.setHeader('Cache-Control', 'no-cache')
      res.sendFile(join(clientDir, 'index.html'))
    })
  }

  app.use(errorHandler)

  return {
    app,
    close() {
      ;(store as unknown as { stopExpiringSessions(): void }).stopExpiringSessions()
    },
  }
}
