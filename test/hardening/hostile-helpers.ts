/**
 * Helpers of the hostile-input tests: the compiled command run as a child with a bound on a
 * hang (never a speed check), lying image headers, and a look at what a run left behind.
 */
import {spawn} from 'node:child_process'
import {readdirSync} from 'node:fs'
import {crc32} from 'node:zlib'
import {CLI, ROOT} from '../cli/helpers.js'

export interface BoundedRun {
  status: number | null
  signal: NodeJS.Signals | null
  stdout: string
  stderr: string
  /** True when the run was stopped at the bound: it would have hung. */
  hung: boolean
}

/**
 * Runs the command; stops it after `limitMs` (a bound on a hang: the hostile inputs ran for
 * minutes or until memory was gone). stdin stays an open pipe unless `closeStdin`, so that
 * a read of the standard input would wait for ever.
 */
export function runBounded(args: string[], opts: {cwd?: string; limitMs?: number; env?: Record<string, string>} = {}): Promise<BoundedRun> {
  return new Promise((resolve) => {
    const child = spawn(process.execPath, [CLI, ...args], {
      cwd: opts.cwd ?? ROOT, env: {...process.env, NO_COLOR: '1', ...opts.env}, stdio: ['pipe', 'pipe', 'pipe']
    })
    let stdout = ''
    let stderr = ''
    let hung = false
    child.stdout.setEncoding('utf8').on('data', (s: string) => { stdout += s })
    child.stderr.setEncoding('utf8').on('data', (s: string) => { stderr += s })
    const timer = setTimeout(() => { hung = true; child.kill('SIGKILL') }, opts.limitMs ?? 60_000)
    child.on('close', (status, signal) => {
      clearTimeout(timer)
      resolve({status, signal, stdout, stderr, hung})
    })
  })
}

const chunk = (type: string, data: Buffer): Buffer => {
  const len = Buffer.alloc(4)
  len.writeUInt32BE(data.length)
  const td = Buffer.concat([Buffer.from(type, 'ascii'), data])
  const crc = Buffer.alloc(4)
  crc.writeUInt32BE(crc32(td))
  return Buffer.concat([len, td, crc])
}

const PNG_SIGNATURE = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a])

/** A PNG whose header says `w` × `h` of `colourType` at `depth`, with `idat` as its only data. */
export function pngClaiming(w: number, h: number, idat: Buffer, colourType = 6, depth = 8): Buffer {
  const ihdr = Buffer.alloc(13)
  ihdr.writeUInt32BE(w, 0)
  ihdr.writeUInt32BE(h, 4)
  ihdr[8] = depth
  ihdr[9] = colourType
  return Buffer.concat([PNG_SIGNATURE, chunk('IHDR', ihdr), chunk('IDAT', idat), chunk('IEND', Buffer.alloc(0))])
}

/** A JPEG start with one baseline frame header claiming `w` × `h`, and no image data. */
export function jpegClaiming(w: number, h: number): Buffer {
  const sof = Buffer.from([0xff, 0xc0, 0x00, 0x11, 0x08, (h >> 8) & 0xff, h & 0xff, (w >> 8) & 0xff, w & 0xff, 0x03,
    0x01, 0x22, 0x00, 0x02, 0x11, 0x01, 0x03, 0x11, 0x01])
  return Buffer.concat([Buffer.from([0xff, 0xd8]), sof, Buffer.from([0xff, 0xd9])])
}

/** Every file under `dir`, recursively, relative to it, sorted. */
export const filesUnder = (dir: string): string[] =>
  readdirSync(dir, {recursive: true, encoding: 'utf8'}).sort()

/** No JavaScript stack frame and no raw engine error text in the output. */
export const noStackTrace = (s: string): boolean => !/\n\s+at .+:\d+:\d+\)?/.test(s) && !/RangeError|TypeError|Maximum call stack/.test(s)
