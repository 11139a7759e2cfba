/**
 * The map extract on the permit, drawn as vector paths with pdfkit (no tiles, no internet):
 * streets, the works' footprints and the affected pipes, in the projected metric CRS, with a
 * scale bar and a grid-north arrow. Colours follow the common utility colour code (water blue,
 * gas yellow, sewer green); district heating is drawn dark red and other media grey; the works
 * are magenta and dashed so they stand apart from every pipe.
 */

export type GridXY = [number, number]

export interface MapStreet {
  name: string
  line: GridXY[]
}

export interface MapWorks {
  label: string
  kind: string
  /** Footprint ring (excavation, fill) or mat squares (crane), in grid metres. */
  rings: GridXY[][]
}

export interface MapPipe {
  medium: string
  line: GridXY[]
}

export interface MapExtractData {
  streets: MapStreet[]
  works: MapWorks[]
  pipes: MapPipe[]
}

export const MEDIUM_COLOURS: Record<string, string> = {
  water: '#1f5fbf',
  gas: '#d4a900',
  sewer: '#2e8b3a',
  district_heating: '#9b2d20',
  other: '#6b6b6b',
}
const WORKS_COLOUR = '#d0198a'
const STREET_COLOUR = '#b9b9b9'

/** Bounds of the works and pipes with a margin, at least `minSide_m` on each side. */
export function mapBounds(data: MapExtractData, minSide_m = 80, margin_m = 15) {
  const pts = [...data.works.flatMap((w) => w.rings.flat()), ...data.pipes.flatMap((p) => p.line)]
  if (!pts.length) return { minX: 0, minY: 0, maxX: minSide_m, maxY: minSide_m }
  let minX = Math.min(...pts.map((p) => p[0])) - margin_m
  let maxX = Math.max(...pts.map((p) => p[0])) + margin_m
  let minY = Math.min(...pts.map((p) => p[1])) - margin_m
  let maxY = Math.max(...pts.map((p) => p[1])) + margin_m
  if (maxX - minX < minSide_m) {
    const c = (minX + maxX) / 2
    minX = c - minSide_m / 2
    maxX = c + minSide_m / 2
  }
  if (maxY - minY < minSide_m) {
    const c = (minY + maxY) / 2
    minY = c - minSide_m / 2
    maxY = c + minSide_m / 2
  }
  return { minX, minY, maxX, maxY }
}

/** A round scale-bar length (1, 2 or 5 × 10^n m) close to `target_m`. */
export function niceLength_m(target_m: number): number {
  const p = 10 ** Math.floor(Math.log10(target_m))
  const n = target_m / p
  return (n >= 5 ? 5 : n >= 2 ? 2 : 1) * p
}

/** Draw the extract into the box (x, y, w, h) in page points. */
export function drawMapExtract(
  doc: PDFKit.PDFDocument,
  box: { x: number; y: number; w: number; h: number },
  data: MapExtractData,
  fonts: { regular: string; bold: string },
): void {
  const b = mapBounds(data)
  const scale = Math.min(box.w / (b.maxX - b.minX), box.h / (b.maxY - b.minY))
  const cx = (b.minX + b.maxX) / 2
  const cy = (b.minY + b.maxY) / 2
  const toPage = ([x, y]: GridXY): [number, number] => [
    box.x + box.w / 2 + (x - cx) * scale,
    box.y + box.h / 2 - (y - cy) * scale,
  ]
  const path = (pts: GridXY[]) => {
    pts.forEach((p, i) => {
      const [px, py] = toPage(p)
      if (i === 0) doc.moveTo(px, py)
      else doc.lineTo(px, py)
    })
  }

  doc.save()
  doc.rect(box.x, box.y, box.w, box.h).fillAndStroke('#fbfbf8', '#444444')
  doc.rect(box.x, box.y, box.w, box.h).clip()

  doc.lineCap('round').lineJoin('round')
  for (const s of data.streets) {
    path(s.line)
    doc
      .lineWidth(Math.max(2, 7 * scale))
      .strokeColor(STREET_COLOUR)
      .stroke()
  }
  doc.font(fonts.regular).fontSize(6.5).fillColor('#555555')
  for (const s of data.streets) {
    const mid = s.line[Math.floor(s.line.length / 2)]
    if (!mid) continue
    const [px, py] = toPage(mid)
    if (px > box.x && px < box.x + box.w - 40 && py > box.y + 6 && py < box.y + box.h - 6) {
      doc.text(s.name, px + 2, py + 3, { lineBreak: false })
    }
  }
  for (const p of data.pipes) {
    path(p.line)
    doc
      .lineWidth(2.2)
      .strokeColor(MEDIUM_COLOURS[p.medium] ?? MEDIUM_COLOURS.other!)
      .stroke()
  }
  for (const w of data.works) {
    for (const ring of w.rings) {
      path([...ring, ring[0]!])
      doc.closePath()
      doc
        .lineWidth(1.4)
        .dash(4, { space: 2.5 })
        .fillOpacity(0.12)
        .fillAndStroke(WORKS_COLOUR, WORKS_COLOUR)
      doc.undash().fillOpacity(1)
    }
  }
  doc.restore()

  // Scale bar, bottom left.
  const bar_m = niceLength_m((box.w * 0.25) / scale)
  const barW = bar_m * scale
  const bx = box.x + 10
  const by = box.y + box.h - 14
  doc.save()
  doc
    .rect(bx - 4, by - 12, barW + 40, 22)
    .fillOpacity(0.85)
    .fill('#ffffff')
    .fillOpacity(1)
  doc.lineWidth(1).strokeColor('#000000')
  doc.rect(bx, by, barW / 2, 4).fill('#000000')
  doc.rect(bx + barW / 2, by, barW / 2, 4).stroke()
  doc.font(fonts.regular).fontSize(7).fillColor('#000000')
  doc.text(`${bar_m} m`, bx + barW + 4, by - 2, { lineBreak: false })
  doc.text('0', bx - 1, by - 10, { lineBreak: false })
  doc.restore()

  // Grid-north arrow, top right.
  const nx = box.x + box.w - 18
  const ny = box.y + 12
  doc.save()
  doc
    .moveTo(nx, ny)
    .lineTo(nx - 6, ny + 18)
    .lineTo(nx, ny + 13)
    .lineTo(nx + 6, ny + 18)
    .closePath()
  doc.fill('#000000')
  doc
    .font(fonts.bold)
    .fontSize(8)
    .fillColor('#000000')
    .text('N', nx - 3, ny + 19, { lineBreak: false })
  doc.restore()

  // Legend below the box.
  const ly = box.y + box.h + 5
  let lx = box.x
  doc.save().font(fonts.regular).fontSize(7).fillColor('#000000')
  const media = [...new Set(data.pipes.map((p) => p.medium))]
  for (const m of media) {
    doc
      .moveTo(lx, ly + 4)
      .lineTo(lx + 16, ly + 4)
      .lineWidth(2.2)
      .strokeColor(MEDIUM_COLOURS[m] ?? MEDIUM_COLOURS.other!)
      .stroke()
    doc.text(`${m.replace('_', ' ')} pipe`, lx + 20, ly, { lineBreak: false })
    lx += 90
  }
  doc
    .moveTo(lx, ly + 4)
    .lineTo(lx + 16, ly + 4)
    .lineWidth(1.4)
    .dash(4, { space: 2.5 })
    .strokeColor(WORKS_COLOUR)
    .stroke()
  doc.undash()
  doc.text('planned works', lx + 20, ly, { lineBreak: false })
  lx += 90
  doc
    .moveTo(lx, ly + 4)
    .lineTo(lx + 16, ly + 4)
    .lineWidth(4)
    .strokeColor(STREET_COLOUR)
    .stroke()
  doc.text('street', lx + 20, ly, { lineBreak: false })
  doc.restore()
  doc.lineWidth(1).strokeColor('#000000').fillColor('#000000')
}
