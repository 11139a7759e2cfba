/**
 * Local fake SMTP server for development and tests: listens on loopback only, accepts every
 * mail without sending it anywhere, and writes each one as JSON into a folder the app's admin
 * "Outgoing mail" page reads. Usage: node --import tsx scripts/fake-smtp.ts <folder> [port]
 */
import { mkdirSync, writeFileSync } from 'node:fs'
import { join } from 'node:path'
import { randomUUID } from 'node:crypto'
import { SMTPServer } from 'smtp-server'
import { simpleParser } from 'mailparser'
import type { AddressObject } from 'mailparser'

const dir = process.argv[2]
const port = Number(process.argv[3] ?? 2525)
if (!dir) {
  console.error('usage: fake-smtp.ts <folder> [port]')
  process.exit(2)
}
mkdirSync(dir, { recursive: true })

const addresses = (a: AddressObject | AddressObject[] | undefined): string =>
  (Array.isArray(a) ? a : a ? [a] : []).map((x) => x.text).join(', ')

const server = new SMTPServer({
  authOptional: true,
  disabledCommands: ['STARTTLS'],
  banner: 'Trenchward local mail catcher',
  size: 25 * 1024 * 1024,
  onData(stream, _session, callback) {
    simpleParser(stream)
      .then((mail) => {
        const receivedAt = new Date().toISOString()
        const id = `${receivedAt.replace(/[:.]/g, '-')}-${randomUUID().slice(0, 8)}`
        const record = {
          id,
          from: addresses(mail.from),
          to: addresses(mail.to),
          subject: mail.subject ?? '',
          text: mail.text ?? '',
          html: typeof mail.html === 'string' ? mail.html : null,
          receivedAt,
          attachments: mail.attachments.map((a) => ({
            filename: a.filename,
            size: a.size,
            contentType: a.contentType,
          })),
        }
        writeFileSync(join(dir, `${id}.json`), JSON.stringify(record, null, 2))
        callback()
      })
      .catch((err: Error) => callback(err))
  },
})

server.on('error', (err) => console.error('[fake-smtp]', err.message))
server.listen(port, '127.0.0.1', () => {
  console.error(`[fake-smtp] catching mail on 127.0.0.1:${port} into ${dir}`)
})
const stop = () => server.close(() => process.exit(0))
process.on('SIGINT', stop)
process.on('SIGTERM', stop)
