import { createHash, randomUUID } from 'node:crypto'
import { createReadStream } from 'node:fs'
import { copyFile, mkdir, stat } from 'node:fs/promises'
import { basename, join, resolve } from 'node:path'
import type { Sequelize } from 'sequelize'
import type { ImportFormat, NetworkImportDto } from '../../../shared/types/network.ts'
import type { AppConfig } from '../../config.ts'
import type { User } from '../../models/user.ts'
import { createImportJob, getImportJob, runCommit, runValidation } from './import-jobs.ts'
import { NetworkImport } from '../../models/index.ts'
import { getImportMapping } from '../import-mappings.ts'

async function sha256Of(path: string): Promise<string> {
  const h = createHash('sha256')
  for await (const chunk of createReadStream(path)) h.update(chunk as Buffer)
  return h.digest('hex')
}

/**
 * Import a file from the server's disk through the same job, validate and commit passes as an
 * upload, as the given engineer (used by the demo seed). The file is copied into the upload
 * folder first, as an upload would be. Nothing is written unless every feature is valid.
 *
 * @returns the finished job (status committed), or throws with the job's problems
 */
export async function importLocalFile(
  user: User,
  path: string,
  format: ImportFormat,
  cfg: AppConfig,
  sequelize: Sequelize,
): Promise<NetworkImportDto> {
  await mkdir(cfg.uploadDir, { recursive: true })
  const target = resolve(join(cfg.uploadDir, `${randomUUID()}.upload`))
  await copyFile(path, target)
  const job = await createImportJob(user, {
    path: target,
    sha256: await sha256Of(target),
    sizeBytes: (await stat(target)).size,
    originalFilename: basename(path),
    format,
  })
  await NetworkImport.update(
    { status: 'validating', mappingSnapshot: await getImportMapping(job.ownerOrganisationId) },
    { where: { id: job.id } },
  )
  await runValidation(job.id, cfg)
  const validated = await getImportJob(user, job.id)
  if (validated.status !== 'validated' || validated.featuresInvalid > 0) {
    const row = await NetworkImport.findByPk(job.id)
    const issues = [...validated.fileIssues, ...(row?.featureIssues ?? []).slice(0, 5)].map(
      (i) => `${i.field}: ${i.message}`,
    )
    throw new Error(
      `${basename(path)}: ${validated.status}, ${validated.featuresInvalid} invalid features (${issues.join('; ')})`,
    )
  }
  await NetworkImport.update(
    { status: 'committing', skipInvalid: false, featuresProcessed: 0 },
    { where: { id: job.id } },
  )
  await runCommit(job.id, user.id, cfg, sequelize)
  return getImportJob(user, job.id)
}
