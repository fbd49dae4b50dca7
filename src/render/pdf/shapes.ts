/**
 * Small vector shapes that carry meaning next to a word, so that severity and verdicts never
 * rest on colour alone: circle (info), triangle (caution), diamond (warning), octagon
 * (safety), check (met), cross (not met), dash (not evaluated), and the task-list box.
 * Each draws inside a `size` × `size` square whose top-left corner is (x, y).
 */
import type {PdfDoc} from './pdfkit.js'
import type {CalloutKind} from './theme.js'

/** White exclamation mark centred at cx, spanning y0..y1. */
function exclamation(doc: PdfDoc, cx: number, y0: number, y1: number, size: number): void {
  const w = Math.max(size * 0.11, 0.8)
  const dot = (y1 - y0) * 0.2
  doc.rect(cx - w / 2, y0, w, (y1 - y0) - dot * 1.6).fill('#ffffff')
  doc.rect(cx - w / 2, y1 - dot, w, dot).fill('#ffffff')
}

function polygonAround(cx: number, cy: number, r: number, sides: number, rotation: number): [number, number][] {
  const pts: [number, number][] = []
  for (let i = 0; i < sides; i++) {
    const a = rotation + (i * 2 * Math.PI) / sides
    pts.push([cx + r * Math.cos(a), cy + r * Math.sin(a)])
  }
  return pts
}

function check(doc: PdfDoc, x: number, y: number, s: number, colour: string, width: number): void {
  doc.save().lineWidth(width).lineCap('round').lineJoin('round')
    .moveTo(x + s * 0.12, y + s * 0.55).lineTo(x + s * 0.4, y + s * 0.83).lineTo(x + s * 0.9, y + s * 0.18)
    .stroke(colour).restore()
}

function cross(doc: PdfDoc, x: number, y: number, s: number, colour: string, width: number): void {
  doc.save().lineWidth(width).lineCap('round')
    .moveTo(x + s * 0.18, y + s * 0.18).lineTo(x + s * 0.82, y + s * 0.82)
    .moveTo(x + s * 0.82, y + s * 0.18).lineTo(x + s * 0.18, y + s * 0.82)
    .stroke(colour).restore()
}

/** Draws the shape for `kind` in `colour`. */
export function drawShape(doc: PdfDoc, kind: CalloutKind, x: number, y: number, size: number, colour: string): void {
  const s = size
  const cx = x + s / 2
  const cy = y + s / 2
  const stroke = Math.max(s * 0.16, 1)
  doc.save()
  switch (kind) {
    case 'info':
      doc.circle(cx, cy, s / 2).fill(colour)
      doc.rect(cx - s * 0.06, cy - s * 0.08, s * 0.12, s * 0.34).fill('#ffffff')
      doc.rect(cx - s * 0.06, cy - s * 0.3, s * 0.12, s * 0.12).fill('#ffffff')
      break
    case 'caution':
      doc.polygon([cx, y], [x + s, y + s * 0.92], [x, y + s * 0.92]).fill(colour)
      exclamation(doc, cx, y + s * 0.32, y + s * 0.82, s)
      break
    case 'warning':
      doc.polygon([cx, y], [x + s, cy], [cx, y + s], [x, cy]).fill(colour)
      exclamation(doc, cx, y + s * 0.22, y + s * 0.76, s)
      break
    case 'safety':
      doc.polygon(...polygonAround(cx, cy, s / 2, 8, Math.PI / 8)).fill(colour)
      exclamation(doc, cx, y + s * 0.2, y + s * 0.8, s)
      break
    case 'met':
      check(doc, x, y, s, colour, stroke)
      break
    case 'not-met':
      cross(doc, x, y, s, colour, stroke)
      break
    case 'not-evaluated':
      doc.save().lineWidth(stroke).lineCap('round').moveTo(x + s * 0.18, cy).lineTo(x + s * 0.82, cy).stroke(colour).restore()
      break
  }
  doc.restore()
}

/** A task-list box, ticked when `checked`. */
export function drawTaskBox(doc: PdfDoc, x: number, y: number, size: number, checked: boolean, colour: string): void {
  doc.save().lineWidth(0.8).rect(x, y, size, size).stroke(colour).restore()
  if (checked) check(doc, x + size * 0.1, y + size * 0.05, size * 0.85, colour, Math.max(size * 0.14, 1))
}
