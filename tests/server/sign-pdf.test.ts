import { execFileSync } from 'node:child_process'
import { mkdtempSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { describe, expect, it } from 'vitest'
import PDFDocument from 'pdfkit'
import { endAndSign } from '../../server/pdf/sign-pdf.ts'
import { loadOrCreateSigningKey } from '../../server/pdf/signing-key.ts'

// pdfsig is poppler's signature validator (Debian poppler-utils, installed by scripts/test).
const pdfsig = (file: string) => {
  try {
    return execFileSync('pdfsig', [file], { encoding: 'utf8' })
  } catch (err) {
    return String((err as { stdout?: string }).stdout ?? '')
  }
}

describe('signed PDFs', () => {
  it('verify as signed and unaltered, and a one-byte change is detected', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'tw-sign-'))
    const key = await loadOrCreateSigningKey(join(dir, 'keys'))
    const again = await loadOrCreateSigningKey(join(dir, 'keys'))
    expect(again.certificateSha256).toBe(key.certificateSha256)

    const doc = new PDFDocument({ size: 'A4' })
    doc.fontSize(14).text('Test permit for a signature check')
    const pdf = await endAndSign(doc, key, {
      reason: 'Permit',
      name: 'Test',
      location: 'Test',
      contactInfo: 'test@example.test',
    })
    const file = join(dir, 'signed.pdf')
    writeFileSync(file, pdf)
    const ok = pdfsig(file)
    expect(ok).toMatch(/Signature is Valid/)
    expect(ok).toMatch(/Total document signed/)

    const tampered = Buffer.from(pdf)
    // One byte of the page's content stream, inside the signed range.
    const at = tampered.indexOf('\nstream\n') + 12
    expect(at).toBeGreaterThan(12)
    tampered[at] = tampered[at]! ^ 0x01
    const bad = join(dir, 'tampered.pdf')
    writeFileSync(bad, tampered)
    expect(pdfsig(bad)).toMatch(/Digest Mismatch|Signature is Invalid/)
  })
})
