/**
 * Set-up shared by the city-scale benchmarks: open the bench database holding the first n
 * segments of the synthetic city (loading it when short), and the bench people: an applicant
 * firm, an engineer for each network owner, a permit officer (all invented).
 */
import bcrypt from 'bcrypt'
import { mkdtempSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import type { Sequelize } from 'sequelize'
import type { AppConfig } from '../../server/config.ts'
import { parseConfig, setConfig } from '../../server/config.ts'
import { createMigrator } from '../../server/db/migrate.ts'
import { createSequelize } from '../../server/db/sequelize.ts'
import { Organisation, User, initModels } from '../../server/models/index.ts'
import { createDraft, submitApplication } from '../../server/services/applications.ts'
import type { ApplicationDto } from '../../shared/types/application.ts'
import { ensureDatabase, testEnv } from '../../tests/helpers/local-env.ts'
import { centreActivities } from './screening-scale-activities.ts'
import {
  cityOwners,
  loadSyntheticCity,
  scaleDb,
  storedCitySegments,
  syntheticBbox,
} from './synthetic-network.ts'

/** Password of every bench user (bench databases only). */
export const BENCH_PASSWORD = 'bench password long enough'

/** The environment of an app on the bench city of n segments (for child processes too). */
export function cityEnv(n: number, extra: Record<string, string> = {}): Record<string, string> {
  const keys = mkdtempSync(join(tmpdir(), 'tw-bench-'))
  return testEnv(scaleDb(n), {
    NODE_ENV: 'development',
    SERVICE_AREA_BBOX: syntheticBbox(1_000_000).join(','),
    KEY_DIR: join(keys, 'keys'),
    PERMIT_DIR: join(keys, 'permits'),
    ...extra,
  })
}

/** Open (and if short, load) the bench city of n segments; sets the process config. */
export async function openCity(n: number): Promise<{ cfg: AppConfig; sequelize: Sequelize }> {
  ensureDatabase(scaleDb(n))
  const cfg = parseConfig(cityEnv(n))
  setConfig(cfg)
  const sequelize = createSequelize(cfg)
  await createMigrator(sequelize, cfg.PROJECTED_EPSG).up()
  initModels(sequelize)
  if ((await storedCitySegments(sequelize)) < n) {
    console.log(`loading ${n.toLocaleString('en')} segments into ${scaleDb(n)} …`)
    const r = await loadSyntheticCity(sequelize, cfg.PROJECTED_EPSG, n)
    console.log(`  wrote ${r.written.toLocaleString('en')} in ${r.seconds.toFixed(0)} s`)
  }
  return { cfg, sequelize }
}

async function benchPerson(
  email: string,
  name: string,
  role: User['role'],
  organisationId: number,
): Promise<User> {
  const found = await User.findOne({ where: { email } })
  if (found && found.passwordHash.startsWith('$2')) return found
  if (found) return found.update({ passwordHash: await bcrypt.hash(BENCH_PASSWORD, 10) })
  return User.create({
    email,
    name,
    role,
    organisationId,
    passwordHash: await bcrypt.hash(BENCH_PASSWORD, 10),
    lockedUntil: null,
    lastSignInAt: null,
  })
}

/** The bench applicant and permit officer (created once per database). */
export async function benchUsers(
  sequelize: Sequelize,
): Promise<{ applicant: User; officer: User }> {
  const org =
    (await Organisation.findOne({ where: { name: 'Bench civil works' } })) ??
    (await Organisation.create({ name: 'Bench civil works', kind: 'contractor', medium: null }))
  const office =
    (await Organisation.findOne({ where: { name: 'Bench street authority' } })) ??
    (await Organisation.create({
      name: 'Bench street authority',
      kind: 'street_authority',
      medium: null,
    }))
  // One engineer per owner, so submitting opens real reviews and queues real mail.
  for (const [medium, ownerId] of await cityOwners(sequelize))
    await benchPerson(
      `bench-scale-${medium}@example.test`,
      `Bench ${medium} engineer`,
      'asset_engineer',
      ownerId,
    )
  return {
    applicant: await benchPerson(
      'bench-scale-applicant@example.test',
      'Bench applicant',
      'applicant',
      org.id,
    ),
    officer: await benchPerson(
      'bench-scale-officer@example.test',
      'Bench officer',
      'permit_officer',
      office.id,
    ),
  }
}

/** A new draft with the three centre activities, submitted (screened) through the service. */
export async function submitCentreApplication(
  sequelize: Sequelize,
  cfg: AppConfig,
  applicant: User,
  title: string,
): Promise<{ draft: ApplicationDto; submit: () => Promise<ApplicationDto> }> {
  const day = (d: number) => new Date(Date.now() + d * 86_400_000).toISOString().slice(0, 10)
  const draft = await createDraft(sequelize, applicant, {
    title,
    siteAddress: 'Centre crossing, synthetic city',
    contactName: 'Bench applicant',
    contactPhone: '+49 5121 000000',
    startsOn: day(14),
    endsOn: day(20),
    description: 'House connection with a crane lift and a spoil heap beside the pit.',
    activities: centreActivities(cfg.PROJECTED_EPSG),
  })
  return { draft, submit: () => submitApplication(sequelize, applicant, draft.id, draft.version) }
}
