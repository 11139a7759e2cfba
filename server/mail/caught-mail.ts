import { readdir, readFile } from 'node:fs/promises'
import { join } from 'node:path'

/** A mail caught by the local fake SMTP server (scripts/fake-smtp.ts), as the admin page shows it. */
export interface CaughtMailDto {
  id: string
  from: string
  to: string
  subject: string
  text: string
  html: string | null
  receivedAt: string
}

/** The newest caught mails (development only), read from the catcher's folder. */
export async function listCaughtMail(dir: string, limit = 200): Promise<CaughtMailDto[]> {
  let names: string[]
  try {
    names = (await readdir(dir)).filter((n) => n.endsWith('.json'))
  } catch {
    return []
  }
  names.sort().reverse()
  const items = await Promise.all(
    names
      .slice(0, limit)
      .map(async (n) => JSON.parse(await readFile(join(dir, n), 'utf8')) as CaughtMailDto),
  )
  return items
}
