import { rm } from 'node:fs/promises'
import type { IncomingMessage } from 'node:http'
import { extname } from 'node:path'
import type { ImportFormat } from '../../../shared/types/network.ts'
import { IMPORT_FORMATS } from '../../../shared/types/network.ts'
import { validationFailed } from '../../errors.ts'
import { receiveFile } from '../uploads/receive-file.ts'

/** An import upload written to disk. */
export interface ReceivedUpload {
  path: string
  sha256: string
  sizeBytes: number
  originalFilename: string
  format: ImportFormat
}

const FORMAT_BY_EXTENSION: Record<string, ImportFormat> = {
  '.geojson': 'geojson',
  '.json': 'geojson',
  '.csv': 'csv',
  '.txt': 'csv',
}

/**
 * A network file upload (field `file`, optional field `format` = geojson | csv), streamed to
 * `dir`. The format comes from the field, else from the file name; 400 naming `format` when
 * neither tells.
 */
export async function receiveUpload(
  req: IncomingMessage,
  dir: string,
  maxBytes: number,
): Promise<ReceivedUpload> {
  const file = await receiveFile(req, dir, maxBytes)
  const formatField = file.fields.format
  const format = formatField
    ? formatField.trim().toLowerCase()
    : FORMAT_BY_EXTENSION[extname(file.originalFilename).toLowerCase()]
  if (!format || !(IMPORT_FORMATS as readonly string[]).includes(format)) {
    await rm(file.path, { force: true })
    throw validationFailed([
      {
        field: 'format',
        message: formatField
          ? `Unknown format "${formatField}" (geojson or csv)`
          : `Cannot tell the format from the name "${file.originalFilename}"; send format=geojson or format=csv`,
      },
    ])
  }
  return {
    path: file.path,
    sha256: file.sha256,
    sizeBytes: file.sizeBytes,
    originalFilename: file.originalFilename,
    format: format as ImportFormat,
  }
}
