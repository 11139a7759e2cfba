import { Router } from 'express'
import { z } from 'zod'
import { allow } from '../middleware/access.ts'
import { uploadLimiter } from '../middleware/rate-limits.ts'
import {
  addAttachment,
  attachmentFile,
  deleteAttachment,
  listAttachments,
} from '../services/attachments.ts'

const params = z.object({ id: z.coerce.number().int().positive() })
const fileParams = params.extend({ attachmentId: z.coerce.number().int().positive() })

/** Documents of an application: /api/applications/:id/attachments. */
export const attachmentsRouter = Router({ mergeParams: true })
const readers = allow(['applicant', 'asset_engineer', 'permit_officer', 'admin'])

attachmentsRouter.get('/', readers, async (req, res) => {
  res.json({ items: await listAttachments(req.user!, params.parse(req.params).id) })
})

attachmentsRouter.post('/', allow(['applicant']), uploadLimiter, async (req, res) => {
  res.status(201).json(await addAttachment(req, req.user!, params.parse(req.params).id))
})

attachmentsRouter.get('/:attachmentId/file', readers, async (req, res) => {
  const p = fileParams.parse(req.params)
  const f = await attachmentFile(req.user!, p.id, p.attachmentId)
  // attachment() would set the type from the name the uploader chose; the sniffed type wins.
  res.attachment(f.filename)
  res.setHeader('Content-Type', f.contentType)
  res.setHeader('X-Content-Type-Options', 'nosniff')
  res.sendFile(f.path, { dotfiles: 'allow' })
})

attachmentsRouter.delete('/:attachmentId', allow(['applicant']), async (req, res) => {
  const p = fileParams.parse(req.params)
  await deleteAttachment(req.user!, p.id, p.attachmentId)
  res.status(204).end()
})
