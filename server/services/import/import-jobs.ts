import type { Sequelize } from 'sequelize'
import { Op } from 'sequelize'
import type { FieldIssue } from '../../../shared/errors.ts'
import type { ImportMapping } from '../../../shared/schemas/import-mapping.ts'
import type {
  FeatureIssue,
  ImportPreviewDto,
  ImportReportPage,
  ImportStatus,
  NetworkImportDto,
} from '../../../shared/types/network.ts'
import { MAPPABLE_FIELDS } from '../../../shared/schemas/import-mapping.ts'
import {
  SEGMENT_FIELD_UNITS,
  REQUIRED_SEGMENT_FIELDS,
} from '../../../shared/schemas/pipe-segment.ts'
import type { AppConfig } from '../../config.ts'
import { conflict, domainRule, notFound } from '../../errors.ts'
import { logger } from '../../logger.ts'
import { NetworkImport, Organisation } from '../../models/index.ts'
import type { User } from '../../models/user.ts'
import { recordAudit } from '../audit.ts'
import { getImportMapping } from '../import-mappings.ts'
import { scopeCovers, segmentReadScope, segmentWriteOwner } from '../network-access.ts'
import { computeBaseline } from '../pipe-baseline.ts'
import { SEGMENT_BATCH_SIZE, upsertSegments } from '../segment-writer.ts'
import type { SegmentRow } from '../segment-writer.ts'
import { checkedFeatures, readerFor } from './import-features.ts'
import type { ImportSource } from './import-features.ts'
import type { ReceivedUpload } from './receive-upload.ts'
import { FileLevelError } from './source-feature.ts'

/** Feature issues kept in the report; counts stay exact beyond it. */
export const MAX_REPORTED_ISSUES = 5000
/** How often a pass writes its progress to the job row. */
const PROGRESS_EVERY_FEATURES = 1000
/** Features the preview reads for attribute names and samples. */
const PREVIEW_FEATURES = 50
const PREVIEW_SAMPLES = 5

const inFlight = new Map<number, Promise<void>>()

function toDto(j: NetworkImport): NetworkImportDto {
  return {
    id: Number(j.id),
    ownerOrganisationId: j.ownerOrganisationId,
    format: j.format,
    originalFilename: j.originalFilename,
    fileSha256: j.fileSha256,
    fileSizeBytes: Number(j.fileSizeBytes),
    status: j.status,
    skipInvalid: j.skipInvalid,
    featuresTotal: j.featuresTotal,
    featuresProcessed: j.featuresProcessed,
    featuresValid: j.featuresValid,
    featuresInvalid: j.featuresInvalid,
    segmentsInserted: j.segmentsInserted,
    segmentsUpdated: j.segmentsUpdated,
    fileIssues: j.fileIssues ?? [],
    errorMessage: j.errorMessage,
    createdBy: j.createdByUserId,
    createdAt: j.createdAt.toISOString(),
    validatedAt: j.validatedAt ? j.validatedAt.toISOString() : null,
    committedAt: j.committedAt ? j.committedAt.toISOString() : null,
  }
}

/** The job if this user may see it: its owner's engineers and admins; 404 for anyone else. */
async function visibleJob(user: User, id: number): Promise<NetworkImport> {
  const scope = segmentReadScope(user)
  const job = await NetworkImport.findByPk(id)
  if (!job || !scopeCovers(scope, job.ownerOrganisationId)) throw notFound('import', id)
  return job
}

/** The job if this user may act on it (its owner's engineers only). */
async function ownJob(user: User, id: number): Promise<NetworkImport> {
  const owner = segmentWriteOwner(user)
  const job = await NetworkImport.findByPk(id)
  if (!job || job.ownerOrganisationId !== owner) throw notFound('import', id)
  return job
}

async function sourceOf(
  job: NetworkImport,
  cfg: AppConfig,
  mapping: ImportMapping,
): Promise<ImportSource> {
  const owner = await Organisation.findByPk(job.ownerOrganisationId)
  return {
    path: job.filePath,
    format: job.format,
    mapping,
    ownerMedium: owner?.medium ?? null,
    serviceArea: cfg.SERVICE_AREA_BBOX,
    epsg: cfg.PROJECTED_EPSG,
  }
}

/** Record an uploaded file as a new import job of the user's organisation. */
export async function createImportJob(
  user: User,
  upload: ReceivedUpload,
): Promise<NetworkImportDto> {
  const owner = segmentWriteOwner(user)
  const job = await NetworkImport.create({
    ownerOrganisationId: owner,
    createdByUserId: user.id,
    format: upload.format,
    originalFilename: upload.originalFilename,
    filePath: upload.path,
    fileSha256: upload.sha256,
    fileSizeBytes: upload.sizeBytes,
    status: 'uploaded',
    skipInvalid: null,
    mappingSnapshot: null,
    fileIssues: null,
    featureIssues: null,
    errorMessage: null,
    validatedAt: null,
    committedAt: null,
  })
  await recordAudit({
    actorUserId: user.id,
    action: 'network.import.uploaded',
    entityType: 'network_import',
    entityId: job.id,
    details: {
      file: upload.originalFilename,
      sha256: upload.sha256,
      sizeBytes: upload.sizeBytes,
      format: upload.format,
    },
  })
  return toDto(job)
}

/** One job's status and counts (drives the progress bar). */
export async function getImportJob(user: User, id: number): Promise<NetworkImportDto> {
  return toDto(await visibleJob(user, id))
}

/** The owner's import jobs, newest first. */
export async function listImportJobs(user: User, page: number, pageSize: number) {
  const scope = segmentReadScope(user)
  const where = scope.kind === 'owner' ? { ownerOrganisationId: scope.organisationId } : {}
  const { rows, count } = await NetworkImport.findAndCountAll({
    where,
    attributes: { exclude: ['featureIssues', 'mappingSnapshot'] },
    order: [['id', 'DESC']],
    limit: pageSize,
    offset: (page - 1) * pageSize,
  })
  return { items: rows.map(toDto), total: count, page, pageSize }
}

/** A page of the per-feature report of the last validation. */
export async function getImportReport(
  user: User,
  id: number,
  page: number,
  pageSize: number,
): Promise<ImportReportPage> {
  const job = await visibleJob(user, id)
  const all = job.featureIssues ?? []
  return {
    importId: Number(job.id),
    status: job.status,
    featuresInvalid: job.featuresInvalid,
    truncated: job.featureIssuesTruncated,
    items: all.slice((page - 1) * pageSize, page * pageSize),
    total: all.length,
    page,
    pageSize,
  }
}

/**
 * The mapping step's data: attribute names found in the first features, a few sample attribute
 * sets, the owner's current mapping and the fields it can fill.
 */
export async function previewImport(user: User, id: number): Promise<ImportPreviewDto> {
  const job = await ownJob(user, id)
  const mapping = await getImportMapping(job.ownerOrganisationId)
  const reader = readerFor({ path: job.filePath, format: job.format, mapping })
  const samples: Record<string, unknown>[] = []
  const names = new Set<string>()
  const fileIssues: FieldIssue[] = []
  try {
    let n = 0
    for await (const f of reader.features()) {
      for (const k of Object.keys(f.properties ?? {})) names.add(k)
      if (samples.length < PREVIEW_SAMPLES && f.properties) samples.push(f.properties)
      if (++n >= PREVIEW_FEATURES) break
    }
    fileIssues.push(...reader.fileIssues())
  } catch (err) {
    if (!(err instanceof FileLevelError)) throw err
    fileIssues.push(...err.issues)
  }
  const required = new Set<string>(REQUIRED_SEGMENT_FIELDS)
  return {
    importId: Number(job.id),
    format: job.format,
    sourceAttributes: [...new Set([...reader.attributeNames(), ...names])],
    sampleFeatures: samples,
    mapping,
    targetFields: MAPPABLE_FIELDS.map((field) => ({
      field,
      required: required.has(field),
      unit: SEGMENT_FIELD_UNITS[field] ?? null,
    })),
    fileIssues,
  }
}

/** Atomically move a job from one of `from` to `to`; false when another request got there first. */
async function transition(
  id: number,
  from: ImportStatus[],
  to: ImportStatus,
  extra: Record<string, unknown> = {},
): Promise<boolean> {
  const [n] = await NetworkImport.update(
    { status: to, ...extra },
    { where: { id, status: { [Op.in]: from } } },
  )
  return n === 1
}

function track(id: number, run: Promise<void>): Promise<void> {
  const p = run.finally(() => inFlight.delete(id))
  inFlight.set(id, p)
  return p
}

/** A running pass writes progress at least this often; a job silent for longer was cut off. */
export const STALE_JOB_MIN = 10

/**
 * Mark jobs left validating or committing by a stopped process as failed (a commit's
 * transaction died with its connection, so nothing of it was written). Only jobs without
 * progress for STALE_JOB_MIN minutes are touched, so passes running in other processes are left alone.
 */
export async function failInterruptedImports(stale_ms = STALE_JOB_MIN * 60_000): Promise<number> {
  const [n] = await NetworkImport.update(
    {
      status: 'failed',
      errorMessage:
        'Interrupted by a server restart; nothing was imported. Validate and commit again.',
    },
    {
      where: {
        status: { [Op.in]: ['validating', 'committing'] },
        updatedAt: { [Op.lt]: new Date(Date.now() - stale_ms) },
      },
    },
  )
  return n
}

/** Resolves when the job's running pass (if any) has finished; for scripts and tests. */
export async function importSettled(id: number): Promise<void> {
  await inFlight.get(id)
}

/**
 * Start the validate pass with the owner's current mapping (snapshotted on the job, so the commit
 * pass reads the file the same way). Returns at once; poll the job for progress.
 */
export async function startValidation(
  user: User,
  id: number,
  cfg: AppConfig,
): Promise<NetworkImportDto> {
  const job = await ownJob(user, id)
  const mapping = await getImportMapping(job.ownerOrganisationId)
  const ok = await transition(
    Number(job.id),
    ['uploaded', 'validated', 'rejected', 'failed'],
    'validating',
    {
      mappingSnapshot: mapping,
      featuresProcessed: 0,
      errorMessage: null,
    },
  )
  if (!ok) throw conflict(`The import is ${job.status}; it can be validated when that has finished`)
  void track(
    Number(job.id),
    runValidation(Number(job.id), cfg).catch((err) =>
      logger.error({ err, importId: job.id }, 'import validation crashed'),
    ),
  )
  return toDto((await NetworkImport.findByPk(job.id))!)
}

/** The validate pass: stream, map and check every feature; record counts and the report. */
export async function runValidation(id: number, cfg: AppConfig): Promise<void> {
  const job = (await NetworkImport.findByPk(id))!
  const src = await sourceOf(job, cfg, job.mappingSnapshot!)
  const reader = readerFor(src)
  const issues: FeatureIssue[] = []
  let total = 0
  let valid = 0
  let invalid = 0
  let fileIssues: FieldIssue[] = []
  try {
    for await (const f of checkedFeatures(src, reader)) {
      total++
      if (f.ok) valid++
      else {
        invalid++
        for (const i of f.issues) if (issues.length < MAX_REPORTED_ISSUES + 1) issues.push(i)
      }
      if (total % PROGRESS_EVERY_FEATURES === 0)
        await NetworkImport.update({ featuresProcessed: total }, { where: { id } })
    }
    fileIssues = reader.fileIssues()
  } catch (err) {
    if (!(err instanceof FileLevelError)) {
      await NetworkImport.update(
        { status: 'failed', errorMessage: String((err as Error).message).slice(0, 500) },
        { where: { id } },
      )
      throw err
    }
    fileIssues = err.issues
  }
  if (!fileIssues.length && total === 0)
    fileIssues = [{ field: 'features', message: 'The file holds no features' }]
  await NetworkImport.update(
    {
      status: fileIssues.length ? 'rejected' : 'validated',
      featuresTotal: total,
      featuresProcessed: total,
      featuresValid: valid,
      featuresInvalid: invalid,
      fileIssues,
      featureIssues: issues.slice(0, MAX_REPORTED_ISSUES),
      featureIssuesTruncated: issues.length > MAX_REPORTED_ISSUES,
      validatedAt: new Date(),
    },
    { where: { id } },
  )
}

/**
 * Start the commit pass. When the last validation found invalid features the caller must say
 * `skipInvalid: true` explicitly (then only the valid ones land); otherwise nothing is written.
 */
export async function startCommit(
  user: User,
  id: number,
  skipInvalid: boolean,
  cfg: AppConfig,
  sequelize: Sequelize,
): Promise<NetworkImportDto> {
  const job = await ownJob(user, id)
  if (job.status !== 'validated') {
    throw domainRule(
      job.status === 'rejected'
        ? `The file was rejected: ${(job.fileIssues ?? []).map((i) => i.message).join('; ')}`
        : `The import is ${job.status}; only a validated import can be committed`,
      [{ field: 'status', message: `is ${job.status}` }],
    )
  }
  if (job.featuresValid === 0)
    throw domainRule('No feature of the file is valid; nothing to import', [
      { field: 'features', message: 'none valid' },
    ])
  if (job.featuresInvalid > 0 && !skipInvalid) {
    throw domainRule(
      `${job.featuresInvalid} features are invalid; fix them, or choose to skip them and import the ${job.featuresValid} valid ones`,
      [{ field: 'skipInvalid', message: 'must be true to import while invalid features exist' }],
    )
  }
  const ok = await transition(Number(job.id), ['validated'], 'committing', {
    skipInvalid,
    featuresProcessed: 0,
  })
  if (!ok) throw conflict('The import is already being committed')
  void track(
    Number(job.id),
    runCommit(Number(job.id), user.id, cfg, sequelize).catch((err) =>
      logger.warn({ err: (err as Error).message, importId: job.id }, 'import commit rolled back'),
    ),
  )
  return toDto((await NetworkImport.findByPk(job.id))!)
}

/** Test seam: called after each batch is written inside the transaction. */
export interface CommitHooks {
  afterBatch?: (rowsWritten: number) => void | Promise<void>
}

/**
 * The commit pass: ONE transaction over the whole file. Streams the file again through the same
 * checks, computes each valid segment's baseline, upserts in batches of SEGMENT_BATCH_SIZE.
 * Progress is written outside the transaction (another connection) so pollers see it. Any
 * error rolls everything back and marks the job failed; no segment of it remains.
 */
export async function runCommit(
  id: number,
  actorUserId: number | null,
  cfg: AppConfig,
  sequelize: Sequelize,
  hooks: CommitHooks = {},
): Promise<void> {
  const job = (await NetworkImport.findByPk(id))!
  const src = await sourceOf(job, cfg, job.mappingSnapshot!)
  const reader = readerFor(src)
  const t = await sequelize.transaction()
  let processed = 0
  let valid = 0
  let inserted = 0
  let updated = 0
  try {
    let batch: SegmentRow[] = []
    // One batch is written while the next is read, mapped and checked (the database and the
    // CPU work overlap); a failed write surfaces at the next flush or at the end.
    let writing: Promise<void> = Promise.resolve()
    const flush = async () => {
      await writing
      const rows = batch
      const processedSoFar = processed
      batch = []
      writing = (async () => {
        const r = await upsertSegments(sequelize, job.ownerOrganisationId, rows, {
          transaction: t,
          epsg: cfg.PROJECTED_EPSG,
          importId: id,
        })
        inserted += r.inserted
        updated += r.updated
        await hooks.afterBatch?.(inserted + updated)
        await NetworkImport.update({ featuresProcessed: processedSoFar }, { where: { id } })
      })()
      writing.catch(() => undefined)
    }
    for await (const f of checkedFeatures(src, reader)) {
      processed++
      if (!f.ok) continue
      valid++
      batch.push({ ...f.segment, baseline: computeBaseline(f.segment.data) })
      if (batch.length >= SEGMENT_BATCH_SIZE) await flush()
    }
    if (batch.length) await flush()
    await writing
    if (reader.fileIssues().length) throw new Error('the file changed since it was validated')
    if (valid !== job.featuresValid || processed !== job.featuresTotal) {
      throw new Error(
        `the file no longer matches its validation (${valid} valid now, ${job.featuresValid} before)`,
      )
    }
    await NetworkImport.update(
      {
        status: 'committed',
        featuresProcessed: processed,
        segmentsInserted: inserted,
        segmentsUpdated: updated,
        committedAt: new Date(),
        errorMessage: null,
      },
      { where: { id }, transaction: t },
    )
    await recordAudit(
      {
        actorUserId,
        action: 'network.import.committed',
        entityType: 'network_import',
        entityId: id,
        details: {
          inserted,
          updated,
          skippedInvalid: job.featuresInvalid,
          file: job.originalFilename,
          sha256: job.fileSha256,
        },
      },
      t,
    )
    await t.commit()
  } catch (err) {
    await t.rollback()
    await NetworkImport.update(
      {
        status: 'failed',
        errorMessage: `Nothing was imported: ${String((err as Error).message).slice(0, 450)}`,
        segmentsInserted: 0,
        segmentsUpdated: 0,
      },
      { where: { id } },
    )
    throw err
  }
}
