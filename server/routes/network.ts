import { Router } from 'express'
import type { Sequelize } from 'sequelize'
import { formatZodIssues } from '../../shared/schemas/assessment-input.ts'
import { importMappingSchema } from '../../shared/schemas/import-mapping.ts'
import {
  idParamSchema,
  importCommitSchema,
  mapLinesQuerySchema,
  outlineQuerySchema,
  segmentExportQuerySchema,
  segmentListQuerySchema,
} from '../../shared/schemas/network-query.ts'
import { pagingQuerySchema } from '../../shared/schemas/paging.ts'
import { pipeSegmentEditSchema } from '../../shared/schemas/pipe-segment.ts'
import { config } from '../config.ts'
import { validationFailed } from '../errors.ts'
import { allow } from '../middleware/access.ts'
import { getImportMapping, saveImportMapping } from '../services/import-mappings.ts'
import {
  createImportJob,
  getImportJob,
  getImportReport,
  listImportJobs,
  previewImport,
  startCommit,
  startValidation,
} from '../services/import/import-jobs.ts'
import { receiveUpload } from '../services/import/receive-upload.ts'
import { segmentReadScope, segmentWriteOwner } from '../services/network-access.ts'
import { exportSegments } from '../services/network-export.ts'
import { mapLinesInBox } from '../services/network-map-lines.ts'
import { outlineInBox } from '../services/network-outline.ts'
import { getSegment, listSegments, updateSegment } from '../services/network-segments.ts'

const owners = allow(['asset_engineer'])
const ownersAndAdmins = allow(['asset_engineer', 'admin'])

/**
 * /api/network: an owner's pipe segments (list, detail, edit, export, map lines), imports (upload, mapping,
 * validate, report, commit, progress) and, for every signed-in user, the screening outline.
 * Design data never leave through a route open to other organisations (see network-access.ts).
 */
export function networkRouter(sequelize: Sequelize): Router {
  const router = Router()

  router.get('/outline', allow('signed-in'), async (req, res) => {
    const { bbox } = outlineQuerySchema.parse(req.query)
    res.json(
      await outlineInBox(sequelize, config().PROJECTED_EPSG, bbox, config().OUTLINE_MAX_FEATURES),
    )
  })

  router.get('/segments', ownersAndAdmins, async (req, res) => {
    res.json(await listSegments(req.user!, segmentListQuerySchema.parse(req.query)))
  })

  // The owner's network map: compact lines in the view (same access as /segments).
  router.get('/map-lines', ownersAndAdmins, async (req, res) => {
    const q = mapLinesQuerySchema.parse(req.query)
    const scope = segmentReadScope(req.user!)
    const ownerOrganisationId = scope.kind === 'owner' ? scope.organisationId : (q.ownerId ?? null)
    res.json(
      await mapLinesInBox(
        sequelize,
        config().PROJECTED_EPSG,
        { bbox: q.bbox, zoom: q.zoom, ownerOrganisationId },
        config().MAP_LINES_MAX_FEATURES,
      ),
    )
  })

  router.get('/segments/:id', ownersAndAdmins, async (req, res) => {
    const { id } = idParamSchema.parse(req.params)
    res.json(await getSegment(req.user!, id, sequelize, config()))
  })

  router.patch('/segments/:id', owners, async (req, res) => {
    const { id } = idParamSchema.parse(req.params)
    const parsed = pipeSegmentEditSchema.safeParse(req.body)
    // formatZodIssues names each unknown field (a misspelt `cover_m` for `coverStart_m`).
    if (!parsed.success) throw validationFailed(formatZodIssues(parsed.error))
    const edit = parsed.data
    res.json(await updateSegment(req.user!, id, edit, sequelize, config()))
  })

  router.get('/export', ownersAndAdmins, async (req, res) => {
    const q = segmentExportQuerySchema.parse(req.query)
    const scope = segmentReadScope(req.user!)
    const ownerOrganisationId = scope.kind === 'owner' ? scope.organisationId : (q.ownerId ?? null)
    res.setHeader('Content-Type', 'application/geo+json; charset=utf-8')
    res.setHeader(
      'Content-Disposition',
      `attachment; filename="pipe-segments${ownerOrganisationId ? `-${ownerOrganisationId}` : ''}.geojson"`,
    )
    await exportSegments(
      sequelize,
      config().PROJECTED_EPSG,
      { ownerOrganisationId, medium: q.medium },
      res,
    )
    res.end()
  })

  router.get('/mapping', owners, async (req, res) => {
    res.json(await getImportMapping(segmentWriteOwner(req.user!)))
  })

  router.put('/mapping', owners, async (req, res) => {
    const mapping = importMappingSchema.parse(req.body)
    res.json(await saveImportMapping(segmentWriteOwner(req.user!), mapping, req.user!.id))
  })

  router.post('/imports', owners, async (req, res) => {
    segmentWriteOwner(req.user!)
    const cfg = config()
    const upload = await receiveUpload(req, cfg.uploadDir, cfg.IMPORT_MAX_UPLOAD_MB * 1024 * 1024)
    res.status(201).json(await createImportJob(req.user!, upload))
  })

  router.get('/imports', ownersAndAdmins, async (req, res) => {
    const { page, pageSize } = pagingQuerySchema.parse(req.query)
    res.json(await listImportJobs(req.user!, page, pageSize))
  })

  router.get('/imports/:id', ownersAndAdmins, async (req, res) => {
    const { id } = idParamSchema.parse(req.params)
    res.json(await getImportJob(req.user!, id))
  })

  router.get('/imports/:id/preview', owners, async (req, res) => {
    const { id } = idParamSchema.parse(req.params)
    res.json(await previewImport(req.user!, id))
  })

  router.post('/imports/:id/validate', owners, async (req, res) => {
    const { id } = idParamSchema.parse(req.params)
    res.status(202).json(await startValidation(req.user!, id, config()))
  })

  router.get('/imports/:id/report', ownersAndAdmins, async (req, res) => {
    const { id } = idParamSchema.parse(req.params)
    const { page, pageSize } = pagingQuerySchema.parse(req.query)
    res.json(await getImportReport(req.user!, id, page, pageSize))
  })

  router.post('/imports/:id/commit', owners, async (req, res) => {
    const { id } = idParamSchema.parse(req.params)
    const { skipInvalid } = importCommitSchema.parse(req.body)
    res.status(202).json(await startCommit(req.user!, id, skipInvalid, config(), sequelize))
  })

  return router
}
