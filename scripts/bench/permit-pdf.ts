/**
 * Permit PDF with signature: one application at the centre of the bench city is granted once
 * through the real service (which writes issue 1); then the document of that permit is built
 * again and again the way issuing does it (its data from the database, layout with the map
 * extract and QR code, PKCS#7 signature). Floor in the same run: an unsigned one-page PDF with
 * the same fonts and one line of text. It reports; it does not gate.
 * Target: p95 under 300 ms.
 * Usage: node --import tsx scripts/bench/permit-pdf.ts [runs=30] [segments=10000]
 */
import PDFDocument from 'pdfkit'
import { buildSignedPermitPdf, LATO_REGULAR } from '../../server/pdf/permit-pdf.ts'
import { Application, Permit } from '../../server/models/index.ts'
import { grantPermit } from '../../server/services/permit-office.ts'
import { permitDocumentData } from '../../server/services/permit-document-data.ts'
import { permitSigningKey } from '../../server/services/permit-issue.ts'
import { benchUsers, openCity, submitCentreApplication } from './bench-city.ts'
import { fmt, machineLoad, percentile, printTable, ratio, timeRuns } from './bench-util.ts'

const RUNS = Number(process.argv[2] ?? 30) || 30
const N = Number(process.argv[3] ?? 10_000) || 10_000

function plainPdf(): Promise<Buffer> {
  return new Promise((ok, fail) => {
    const doc = new PDFDocument({ size: 'A4', margin: 50 })
    const parts: Buffer[] = []
    doc.on('data', (b: Buffer) => parts.push(b))
    doc.on('end', () => ok(Buffer.concat(parts)))
    doc.on('error', fail)
    doc.registerFont('Lato', LATO_REGULAR)
    doc.font('Lato').fontSize(11).text('Permit to work near buried pipes')
    doc.end()
  })
}

const { cfg, sequelize } = await openCity(N)
try {
  const { applicant, officer } = await benchUsers(sequelize)
  const { submit } = await submitCentreApplication(sequelize, cfg, applicant, 'Bench permit')
  const app = await submit()
  // The owners' reviews are not the subject here: the application goes to the decision directly.
  await Application.update({ status: 'ready_for_decision' }, { where: { id: app.id } })
  const fresh = (await Application.findByPk(app.id))!
  await grantPermit(sequelize, officer, app.id, { version: fresh.version })
  const permit = (await Permit.findOne({ where: { applicationId: app.id } }))!
  const key = await permitSigningKey()

  let bytes = 0
  const floor = await timeRuns(RUNS, 3, async () => {
    bytes = (await plainPdf()).length
  })
  const floorBytes = bytes
  const signed = await timeRuns(RUNS, 3, async () => {
    const data = await permitDocumentData(sequelize, permit, key.certificateSha256)
    bytes = (await buildSignedPermitPdf(data, key)).length
  })
  const f50 = percentile(floor, 50)
  printTable(
    `Permit PDF, ${RUNS} runs; ${machineLoad()}`,
    ['document', 'p50 ms', 'p95 ms', 'p95 / floor p50', 'size KB'],
    [
      [
        'one-page unsigned PDF (floor)',
        fmt(f50),
        fmt(percentile(floor, 95)),
        '1.0×',
        (floorBytes / 1024).toFixed(0),
      ],
      [
        'permit with map, QR and signature',
        fmt(percentile(signed, 50)),
        fmt(percentile(signed, 95)),
        ratio(percentile(signed, 95), f50),
        (bytes / 1024).toFixed(0),
      ],
    ],
  )
  console.log(`\ntarget: p95 < 300 ms (${fmt(percentile(signed, 95))} ms)`)
} finally {
  await sequelize.close()
}
