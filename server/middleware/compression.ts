import compression from 'compression'
import type { Request, RequestHandler, Response } from 'express'

/** Types that are compressed already (or are opaque bytes): sent as they are. */
const ALREADY_COMPRESSED =
  /^(application\/(pdf|zip|gzip|x-gzip|octet-stream)|image\/(?!svg)|video\/|audio\/|font\/woff2?)/i

/**
 * Whether a response is worth gzip: compression's own test (a compressible type, not asked to
 * skip with Cache-Control: no-transform) minus PDFs, raster images, archives and fonts.
 */
export function shouldCompress(req: Request, res: Response): boolean {
  const type = String(res.getHeader('Content-Type') ?? '')
  if (ALREADY_COMPRESSED.test(type)) return false
  return compression.filter(req, res)
}

/** gzip/deflate for JSON, HTML, JavaScript, CSS and SVG responses of 1 kB and more. */
export function textCompression(): RequestHandler {
  return compression({ filter: shouldCompress, threshold: 1024 })
}
