import { SignPdf } from '@signpdf/signpdf'
import { pdfkitAddPlaceholder } from '@signpdf/placeholder-pdfkit'
import type PDFDocument from 'pdfkit'
import { NativeKeySigner } from './native-signer.ts'
import type { SigningKey } from './signing-key.ts'

export interface SignatureInfo {
  reason: string
  name: string
  location: string
  contactInfo: string
}

/**
 * Finish a pdfkit document with a detached PKCS#7 signature (adbe.pkcs7.detached) over the
 * whole file, so a standard validator reports it signed and unaltered. The placeholder must be
 * added before the document ends, hence this takes the open document.
 */
export async function endAndSign(
  doc: PDFKit.PDFDocument,
  key: SigningKey,
  info: SignatureInfo,
): Promise<Buffer> {
  pdfkitAddPlaceholder({
    pdf: doc,
    pdfBuffer: Buffer.from([]),
    reason: info.reason,
    contactInfo: info.contactInfo,
    name: info.name,
    location: info.location,
    signatureLength: 8192,
  })
  const chunks: Buffer[] = []
  const ended = new Promise<Buffer>((resolve, reject) => {
    doc.on('data', (c: Buffer) => chunks.push(c))
    doc.on('end', () => resolve(Buffer.concat(chunks)))
    doc.on('error', reject)
  })
  doc.end()
  const unsigned = await ended
  return new SignPdf().sign(unsigned, new NativeKeySigner(key))
}

export type { PDFDocument }
