/**
 * The type of a file told from its first bytes ("magic numbers"), never from its name or the
 * type the browser declared. Sources: PDF 1.7 (ISO 32000-1) §7.5.2 file header; PNG (ISO/IEC
 * 15948) §5.2 signature; JPEG (ISO/IEC 10918-1) SOI marker with JFIF/Exif; WebP RIFF container.
 */
export type SniffedType = 'application/pdf' | 'image/png' | 'image/jpeg' | 'image/webp'

export const SNIFFED_EXTENSIONS: Record<SniffedType, string> = {
  'application/pdf': '.pdf',
  'image/png': '.png',
  'image/jpeg': '.jpg',
  'image/webp': '.webp',
}

/** The type of the file starting with `head`, or null when it is none of the accepted ones. */
export function sniffContentType(head: Buffer): SniffedType | null {
  if (head.subarray(0, 5).toString('latin1') === '%PDF-') return 'application/pdf'
  if (head.subarray(0, 8).equals(Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]))) {
    return 'image/png'
  }
  if (head[0] === 0xff && head[1] === 0xd8 && head[2] === 0xff) return 'image/jpeg'
  if (
    head.subarray(0, 4).toString('latin1') === 'RIFF' &&
    head.subarray(8, 12).toString('latin1') === 'WEBP'
  ) {
    return 'image/webp'
  }
  return null
}
