import type { IncomingMessage } from 'node:http'
import busboy from 'busboy'
import { ErrorCode } from '../../shared/errors.ts'
import { AppError, validationFailed } from '../errors.ts'

/**
 * Read one PDF from a multipart body (field `file`) into memory, at most `maxBytes`, and check
 * by its content that it is a PDF (it starts with `%PDF-`; the name and the declared type are
 * not trusted). 400 naming the field, or 413 when too large.
 */
export async function receivePdf(req: IncomingMessage, maxBytes: number): Promise<Buffer> {
  if (!/^multipart\/form-data/i.test(req.headers['content-type'] ?? '')) {
    throw validationFailed([
      { field: 'file', message: 'Send the PDF as multipart/form-data in the field "file"' },
    ])
  }
  let bb: busboy.Busboy
  try {
    bb = busboy({
      headers: req.headers,
      limits: { files: 1, fields: 2, fileSize: maxBytes, fieldSize: 256 },
    })
  } catch {
    throw validationFailed([{ field: 'file', message: 'The multipart body is malformed' }])
  }
  const chunks: Buffer[] = []
  let sawFile = false
  let tooLarge = false
  await new Promise<void>((ok, fail) => {
    bb.on('file', (name, stream) => {
      // A body cut short errors the part's stream as well as busboy; busboy's handler below
      // answers, so the part's error must not go unheard (it would crash the process).
      stream.on('error', () => undefined)
      if (name !== 'file' || sawFile) {
        stream.resume()
        return
      }
      sawFile = true
      stream.on('data', (c: Buffer) => chunks.push(c))
      stream.on('limit', () => {
        tooLarge = true
      })
    })
    bb.on('error', () =>
      fail(
        validationFailed([{ field: 'file', message: 'The upload was interrupted or malformed' }]),
      ),
    )
    bb.on('close', () => ok())
    req.pipe(bb)
  })
  if (!sawFile) throw validationFailed([{ field: 'file', message: 'No file in the field "file"' }])
  if (tooLarge) {
    throw new AppError(
      ErrorCode.PAYLOAD_TOO_LARGE,
      413,
      `The file is larger than ${Math.round(maxBytes / 1024 / 1024)} MB`,
    )
  }
  const file = Buffer.concat(chunks)
  if (file.subarray(0, 5).toString('latin1') !== '%PDF-') {
    throw validationFailed([{ field: 'file', message: 'This is not a PDF file' }])
  }
  return file
}
