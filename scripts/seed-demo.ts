/**
 * Loads the invented demo scenario from demo/ (organisations, people, streets, and the pipe
 * networks in demo/networks/, imported through the real import service as each owner's
 * engineer) into an EMPTY database; it does nothing when any organisation exists, so
 * `npm start` can run it every time. The street authority's invented fee schedule
 * (demo/fee-schedules.json) is added on its own whenever no schedule exists yet, so older demo
 * databases get it too.
 * Usage: node --import tsx scripts/seed-demo.ts   (same environment as the server)
 */
import { readFileSync } from 'node:fs'
import { fileURLToPath } from 'node:url'
import { dirname, join } from 'node:path'
import { config } from '../server/config.ts'
import { createSequelize } from '../server/db/sequelize.ts'
import { FeeSchedule, Organisation, User, initModels } from '../server/models/index.ts'
import { feeScheduleInputSchema } from '../shared/schemas/fees.ts'
import { importLocalFile } from '../server/services/import/import-local-file.ts'
import { insertStreets } from '../server/services/streets.ts'
import { createUser } from '../server/services/users.ts'
import { loadDemoApplications } from './demo/load-applications.ts'
import type { OrganisationKind, Role } from '../shared/types/roles.ts'

interface DemoPeople {
  organisations: { key: string; name: string; kind: OrganisationKind; medium?: string | null }[]
  users: { email: string; name: string; role: Role; organisationKey: string; password: string }[]
}
interface DemoFeeSchedules {
  versions: unknown[]
}
interface DemoStreets {
  features: {
    properties: { name: string; category: string }
    geometry: { coordinates: number[][] }
  }[]
}

/** The demo networks and the medium of the network owner each belongs to. */
const NETWORKS = [
  { file: 'wendmoor-water.geojson', ownerMedium: 'water' },
  { file: 'wendmoor-sewer.geojson', ownerMedium: 'water' },
  { file: 'brackenfold-gas.geojson', ownerMedium: 'gas' },
]

const demoDir = join(dirname(fileURLToPath(import.meta.url)), '..', 'demo')
const readJson = <T>(name: string): T => JSON.parse(readFileSync(join(demoDir, name), 'utf8')) as T

const cfg = config()
const sequelize = createSequelize(cfg)
initModels(sequelize)
try {
  if ((await Organisation.count()) > 0) {
    console.error('[seed-demo] database already has data; demo not loaded')
  } else {
    const people = readJson<DemoPeople>('people.json')
    const streets = readJson<DemoStreets>('streets.geojson')
    const orgIds = new Map<string, number>()
    for (const o of people.organisations) {
      const org = await Organisation.create({
        name: o.name,
        kind: o.kind,
        medium: o.medium ?? null,
      })
      orgIds.set(o.key, org.id)
    }
    for (const u of people.users) {
      const organisationId = orgIds.get(u.organisationKey)
      if (!organisationId)
        throw new Error(`demo user ${u.email}: unknown organisation ${u.organisationKey}`)
      await createUser(
        { email: u.email, name: u.name, role: u.role, organisationId, password: u.password },
        null,
      )
    }
    const n = await insertStreets(
      sequelize,
      cfg.PROJECTED_EPSG,
      streets.features.map((f) => ({ ...f.properties, coordinates: f.geometry.coordinates })),
    )
    let segments = 0
    for (const net of NETWORKS) {
      const owner = await Organisation.findOne({
        where: { kind: 'network_owner', medium: net.ownerMedium },
      })
      const engineer =
        owner &&
        (await User.findOne({ where: { organisationId: owner.id, role: 'asset_engineer' } }))
      if (!engineer) {
        throw new Error(
          `demo network ${net.file}: no ${net.ownerMedium} network owner with an engineer`,
        )
      }
      const job = await importLocalFile(
        engineer,
        join(demoDir, 'networks', net.file),
        'geojson',
        cfg,
        sequelize,
      )
      segments += job.segmentsInserted
    }
    const stories = await loadDemoApplications(sequelize, demoDir)
    const applications = Object.values(stories).reduce((a, b) => a + b, 0)
    console.error(
      `[seed-demo] loaded ${people.organisations.length} organisations, ${people.users.length} users, ${n} streets, ${segments} pipe segments, ${applications} applications (${stories.granted} granted)`,
    )
  }
  if ((await FeeSchedule.count()) === 0) {
    const people = readJson<DemoPeople>('people.json')
    const office = people.organisations.find((o) => o.kind === 'street_authority')
    const authority = office && (await Organisation.findOne({ where: { name: office.name } }))
    const officer =
      authority &&
      (await User.findOne({ where: { organisationId: authority.id, role: 'permit_officer' } }))
    if (authority && officer) {
      const { versions } = readJson<DemoFeeSchedules>('fee-schedules.json')
      for (const raw of versions) {
        // The schema checks every price is there; the demo may start in the past, the UI may not.
        const v = feeScheduleInputSchema.parse(raw)
        await FeeSchedule.create({
          authorityOrganisationId: authority.id,
          effectiveFrom: v.effectiveFrom,
          currency: v.currency,
          entries: v.entries,
          variationFeeCents: v.variationFee_cents,
          extensionFeeCents: v.extensionFee_cents,
          refundBeforeReviewPercent: v.refundBeforeReview_percent,
          refundAfterReviewPercent: v.refundAfterReview_percent,
          defaultPaymentTerms: v.defaultPaymentTerms,
          note: v.note ?? null,
          createdByUserId: officer.id,
        })
      }
      console.error(
        `[seed-demo] loaded ${versions.length} fee schedule versions for ${authority.name}`,
      )
    }
  }
} finally {
  await sequelize.close()
}
