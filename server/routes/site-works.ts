import { Router } from 'express'
import type { Sequelize } from 'sequelize'
import { z } from 'zod'
import {
  plannedStartSchema,
  siteChecklistSchema,
  siteEventSchema,
} from '../../shared/schemas/site-works.ts'
import { allow } from '../middleware/access.ts'
import { uploadLimiter } from '../middleware/rate-limits.ts'
import { saveChecklist, sitePack } from '../services/site-pack.ts'
import { worksOnSite } from '../services/works-on-site.ts'
import {
  addSitePhoto,
  getSiteWorks,
  recordFinish,
  recordPlannedStart,
  recordStart,
  sitePhotoFile,
} from '../services/site-works.ts'

const params = z.object({ id: z.coerce.number().int().positive() })
const photoParams = params.extend({ photoId: z.coerce.number().int().positive() })

/** /api/site-works/:id — the works on site of a granted application (by application id). */
export function siteWorksRouter(sequelize: Sequelize): Router {
  const router = Router()
  const parties = allow(['applicant', 'asset_engineer', 'permit_officer', 'admin'])
  const applicants = allow(['applicant'])

  // Before /:id: the office's map of the works on the ground today.
  router.get('/live', allow(['permit_officer', 'admin']), async (req, res) => {
    res.json(await worksOnSite(req.user!))
  })

  router.get('/:id', parties, async (req, res) => {
    res.json(await getSiteWorks(req.user!, params.parse(req.params).id))
  })

  router.get('/:id/pack', parties, async (req, res) => {
    // The site pack's service worker keeps its own copy; the browser cache must not.
    res.setHeader('Cache-Control', 'no-store')
    res.json(await sitePack(sequelize, req.user!, params.parse(req.params).id))
  })

  router.put('/:id/checklist', applicants, async (req, res) => {
    const { id } = params.parse(req.params)
    res.json({
      ticks: await saveChecklist(sequelize, req.user!, id, siteChecklistSchema.parse(req.body)),
    })
  })

  router.post('/:id/planned-start', applicants, async (req, res) => {
    const { id } = params.parse(req.params)
    res
      .status(201)
      .json(await recordPlannedStart(sequelize, req.user!, id, plannedStartSchema.parse(req.body)))
  })

  router.post('/:id/start', applicants, async (req, res) => {
    const { id } = params.parse(req.params)
    res
      .status(201)
      .json(await recordStart(sequelize, req.user!, id, siteEventSchema.parse(req.body)))
  })

  router.post('/:id/finish', applicants, async (req, res) => {
    const { id } = params.parse(req.params)
    res
      .status(201)
      .json(await recordFinish(sequelize, req.user!, id, siteEventSchema.parse(req.body)))
  })

  router.post('/:id/photos', applicants, uploadLimiter, async (req, res) => {
    res.status(201).json(await addSitePhoto(req, req.user!, params.parse(req.params).id))
  })

  router.get('/:id/photos/:photoId/file', parties, async (req, res) => {
    const p = photoParams.parse(req.params)
    const f = await sitePhotoFile(req.user!, p.id, p.photoId)
    res.setHeader('Content-Type', f.contentType)
    res.setHeader('X-Content-Type-Options', 'nosniff')
    res.attachment(f.filename)
    res.sendFile(f.path, { dotfiles: 'allow' })
  })

  return router
}
