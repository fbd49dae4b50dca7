/**
 * PNG and JPEG headers checked against their data before pdfkit sees the bytes: pdfkit
 * trusts the header, so a 68-byte PNG claiming 50000 × 50000 RGBA made it allocate until
 * it threw a RangeError, and a header claiming more pixels than the data holds was
 * embedded as is (viewers then refuse the page). Pure: bytes in, a verdict out.
 *
 * Checked: the signature; for PNG the IHDR fields (size, bit depth against colour type,
 * methods), every chunk inside the file, a palette for indexed colour, and the inflated
 * image data at least as long as the header implies; for JPEG the segment structure up to
 * the first scan, a frame header with a non-zero size, 8-bit precision and 1, 3 or 4
 * components, and scan data after it. Both: at most MAX_IMAGE_PIXELS pixels.
 */
import {inflateSync} from 'node:zlib'

/** Most pixels an image may have (32 Mi: a 6000 × 4000 photograph fits; README, Limits). */
export const MAX_IMAGE_PIXELS = 32 * 2 ** 20

export type ImageCheck = {ok: true; kind: 'png' | 'jpeg'; width: number; height: number} | {ok: false; why: string}

const bad = (why: string): ImageCheck => ({ok: false, why})
const PNG_SIGNATURE = [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]
/** Valid bit depths of each PNG colour type, and its channels (PNG spec, IHDR). */
const PNG_DEPTHS: Record<number, {depths: number[]; channels: number}> = {
  0: {depths: [1, 2, 4, 8, 16], channels: 1}, 2: {depths: [8, 16], channels: 3}, 3: {depths: [1, 2, 4, 8], channels: 1},
  4: {depths: [8, 16], channels: 2}, 6: {depths: [8, 16], channels: 4}
}
const tooMany = (w: number, h: number): string =>
  `it claims ${w} × ${h} pixels, more than the ${MAX_IMAGE_PIXELS.toLocaleString('en-US')} pixels an image may have`

const isPng = (b: Uint8Array): boolean => b.length >= 8 && PNG_SIGNATURE.every((v, i) => b[i] === v)
const isJpeg = (b: Uint8Array): boolean => b.length >= 3 && b[0] === 0xff && b[1] === 0xd8 && b[2] === 0xff

/** Bytes of the filtered image data a PNG of this header holds (Adam7 passes when interlaced). */
function pngRawLength(w: number, h: number, bitsPerPixel: number, interlaced: boolean): number {
  const rows = (pw: number, ph: number): number => (pw === 0 || ph === 0 ? 0 : ph * (1 + Math.ceil((pw * bitsPerPixel) / 8)))
  if (!interlaced) return rows(w, h)
  const passes = [[0, 0, 8, 8], [4, 0, 8, 8], [0, 4, 4, 8], [2, 0, 4, 4], [0, 2, 2, 4], [1, 0, 2, 2], [0, 1, 1, 2]] as const
  return passes.reduce((n, [x0, y0, dx, dy]) => n + rows(Math.ceil((w - x0) / dx), Math.ceil((h - y0) / dy)), 0)
}

function checkPng(b: Uint8Array): ImageCheck {
  const view = new DataView(b.buffer, b.byteOffset, b.byteLength)
  const type = (at: number): string => String.fromCharCode(b[at]!, b[at + 1]!, b[at + 2]!, b[at + 3]!)
  if (b.length < 33 || view.getUint32(8) !== 13 || type(12) !== 'IHDR') return bad('the PNG has no valid header (IHDR)')
  const w = view.getUint32(16)
  const h = view.getUint32(20)
  const depth = b[24]!
  const colour = b[25]!
  if (w === 0 || h === 0 || w > 2 ** 31 - 1 || h > 2 ** 31 - 1) return bad(`the PNG header claims ${w} × ${h} pixels`)
  const spec = PNG_DEPTHS[colour]
  if (spec === undefined) return bad(`colour type ${colour} is not valid PNG`)
  if (!spec.depths.includes(depth)) return bad(`bit depth ${depth} with colour type ${colour} is not valid PNG`)
  if (b[26] !== 0 || b[27] !== 0 || (b[28] !== 0 && b[28] !== 1)) return bad('the PNG header names an unknown compression, filter or interlace method')
  if (w * h > MAX_IMAGE_PIXELS) return bad(tooMany(w, h))
  const data: Uint8Array[] = []
  let palette = false
  let end = false
  for (let at = 33; at < b.length;) {
    if (at + 12 > b.length) return bad('the PNG is cut short (a chunk runs past the end of the file)')
    const len = view.getUint32(at)
    const t = type(at + 4)
    if (at + 12 + len > b.length) return bad('the PNG is cut short (a chunk runs past the end of the file)')
    if (t === 'PLTE') palette = true
    if (t === 'IDAT') data.push(b.subarray(at + 8, at + 8 + len))
    at += 12 + len
    if (t === 'IEND') { end = true; break }
  }
  if (data.length === 0) return bad('the PNG has no image data (IDAT)')
  if (colour === 3 && !palette) return bad('the PNG uses a palette but has none (PLTE)')
  if (!end) return bad('the PNG is cut short (no IEND)')
  const need = pngRawLength(w, h, depth * spec.channels, b[28] === 1)
  let got: number
  try {
    got = inflateSync(Buffer.concat(data), {maxOutputLength: need}).length
  } catch (error) {
    // Output longer than the header implies stops at the limit: more data than needed is harmless.
    if ((error as NodeJS.ErrnoException).code === 'ERR_BUFFER_TOO_LARGE') got = need
    else return bad('its data is shorter than its header says, or damaged (the compressed data does not end)')
  }
  if (got < need) return bad(`its data is shorter than its header says (${got} of ${need} bytes for ${w} × ${h} pixels)`)
  return {ok: true, kind: 'png', width: w, height: h}
}

/** Start-of-frame markers: baseline, extended, progressive, lossless (Huffman and arithmetic). */
const SOF = new Set([0xc0, 0xc1, 0xc2, 0xc3, 0xc5, 0xc6, 0xc7, 0xc9, 0xca, 0xcb, 0xcd, 0xce, 0xcf])

function checkJpeg(b: Uint8Array): ImageCheck {
  let frame: {w: number; h: number} | null = null
  for (let at = 2; at + 4 <= b.length;) {
    if (b[at] !== 0xff) return bad('the JPEG is damaged (a segment does not start with a marker)')
    const marker = b[at + 1]!
    if (marker === 0xff) { at++; continue }
    if (marker === 0xd9) break
    if (marker === 0x01 || (marker >= 0xd0 && marker <= 0xd7)) { at += 2; continue }
    const len = (b[at + 2]! << 8) | b[at + 3]!
    if (len < 2 || at + 2 + len > b.length) return bad('the JPEG is cut short (a segment runs past the end of the file)')
    if (SOF.has(marker)) {
      if (len < 8) return bad('the JPEG frame header is too short')
      const precision = b[at + 4]!
      const h = (b[at + 5]! << 8) | b[at + 6]!
      const w = (b[at + 7]! << 8) | b[at + 8]!
      const components = b[at + 9]!
      if (w === 0 || h === 0) return bad(`the JPEG frame claims ${w} × ${h} pixels`)
      if (precision !== 8) return bad(`the JPEG has ${precision}-bit samples; only 8-bit JPEG is supported`)
      if (![1, 3, 4].includes(components)) return bad(`the JPEG has ${components} colour components; 1, 3 or 4 expected`)
      if (w * h > MAX_IMAGE_PIXELS) return bad(tooMany(w, h))
      frame = {w, h}
    }
    if (marker === 0xda) {
      if (frame === null) return bad('the JPEG has image data but no frame header')
      if (at + 2 + len >= b.length - 2) return bad('the JPEG has no image data after its scan header')
      return {ok: true, kind: 'jpeg', width: frame.w, height: frame.h}
    }
    at += 2 + len
  }
  return bad(frame === null ? 'the JPEG has no frame header' : 'the JPEG has no image data (no scan)')
}

/** Whether pdfkit can be given these bytes, and if not why (a phrase for "not included: …"). */
export function checkImage(bytes: Uint8Array): ImageCheck {
  if (isPng(bytes)) return checkPng(bytes)
  if (isJpeg(bytes)) return checkJpeg(bytes)
  return bad('only PNG and JPEG images are supported')
}
