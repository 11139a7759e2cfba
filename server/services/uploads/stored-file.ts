import { join, resolve, sep } from 'node:path'
import { notFound } from '../../errors.ts'

/** A stored upload as a route sends it. */
export interface StoredFile {
  path: string
  filename: string
  contentType: string
}

/**
 * The file of an upload row inside its folder. Only the row's random storage name reaches the
 * file system, never a name from the request; a name that would leave the folder answers 404.
 */
export function storedFile(
  dir: string,
  row: { storageName: string; originalFilename: string; contentType: string },
  what: string,
  id: number,
): StoredFile {
  const path = resolve(join(dir, row.storageName))
  if (!path.startsWith(dir + sep)) throw notFound(what, id)
  return { path, filename: row.originalFilename, contentType: row.contentType }
}
