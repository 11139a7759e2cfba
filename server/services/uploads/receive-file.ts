import { createHash, randomUUID } from 'node:crypto'
import { createWriteStream } from 'node:fs'
import { mkdir, rm } from 'node:fs/promises'
import type { IncomingMessage } from 'node:http'
import { join, resolve } from 'node:path'
import { pipeline } from 'node:stream/promises'
import { Transform } from 'node:stream'
import busboy from 'busboy'
import { ErrorCode } from '../../../shared/errors.ts'
import { AppError, validationFailed } from '../../errors.ts'

/** A multipart file written to disk. */
export interface ReceivedFile {
  /** Absolute path of the stored file (a random name inside `dir`). */
  path: string
  sha256: string
  sizeBytes: number
  originalFilename: string
  /** The first bytes of the file, for content sniffing. */
  head: Buffer
  /** The small text fields sent with the file. */
  fields: Record<string, string>
}

const HEAD_BYTES = 16

/**
 * Stream a multipart upload (field `file`, plus up to `maxFields` short text fields) to a new
 * file in `dir`, hashing it on the way; the file never sits in memory. Fails with 400 naming
 * the field, or 413 when it exceeds `maxBytes` (the partial file is removed).
 */
export async function receiveFile(
  req: IncomingMessage,
  dir: string,
  maxBytes: number,
  maxFields = 4,
): Promise<ReceivedFile> {
  if (!/^multipart\/form-data/i.test(req.headers['content-type'] ?? '')) {
    throw validationFailed([
      { field: 'file', message: 'Send the file as multipart/form-data in the field "file"' },
    ])
  }
  await mkdir(dir, { recursive: true })
  const path = resolve(join(dir, `${randomUUID()}.upload`))
  let bb: busboy.Busboy
  try {
    bb = busboy({
      headers: req.headers,
      limits: { files: 1, fields: maxFields, fileSize: maxBytes, fieldSize: 1024 },
      // Browsers send file names as UTF-8; busboy's default (latin1) garbles "Lagepläne.pdf".
      defParamCharset: 'utf8',
    })
  } catch {
    throw validationFailed([{ field: 'file', message: 'The multipart body is malformed' }])
  }
  const fields: Record<string, string> = {}
  let filename = ''
  let sizeBytes = 0
  let tooLarge = false
  let sawFile = false
  let head = Buffer.alloc(0)
  const hash = createHash('sha256')
  let written: Promise<void> | null = null

  const done = new Promise<void>((ok, fail) => {
    bb.on('field', (name, value) => {
      fields[name] = value
    })
    bb.on('file', (name, stream, info) => {
      // A body cut short errors the part's stream too; busboy's own error answers the request.
      stream.on('error', () => undefined)
      if (name !== 'file' || sawFile) {
        stream.resume()
        return
      }
      sawFile = true
      filename = info.filename ?? ''
      stream.on('limit', () => {
        tooLarge = true
      })
      const hasher = new Transform({
        transform(chunk: Buffer, _enc, cb) {
          if (head.length < HEAD_BYTES) head = Buffer.concat([head, chunk.subarray(0, HEAD_BYTES)])
          sizeBytes += chunk.length
          hash.update(chunk)
          cb(null, chunk)
        },
      })
      written = pipeline(stream, hasher, createWriteStream(path))
      written.catch(fail)
    })
    bb.on('error', fail)
    bb.on('close', () => ok())
  })
  req.pipe(bb)
  try {
    await done
    if (written) await written
  } catch {
    await rm(path, { force: true })
    throw validationFailed([{ field: 'file', message: 'The upload was interrupted or malformed' }])
  }
  if (!sawFile) throw validationFailed([{ field: 'file', message: 'No file in the field "file"' }])
  if (tooLarge) {
    await rm(path, { force: true })
    throw new AppError(
      ErrorCode.PAYLOAD_TOO_LARGE,
      413,
      `The file is larger than ${Math.round(maxBytes / 1024 / 1024)} MB`,
    )
  }
  if (sizeBytes === 0) {
    await rm(path, { force: true })
    throw validationFailed([{ field: 'file', message: 'The file is empty' }])
  }
  return {
    path,
    sha256: hash.digest('hex'),
    sizeBytes,
    originalFilename: filename.slice(0, 255) || 'upload',
    head: head.subarray(0, HEAD_BYTES),
    fields,
  }
}
