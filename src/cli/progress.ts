/**
 * Progress on stderr: on a terminal a bar of notes done of total, redrawn in place; off a
 * terminal one plain line per note. Colour only on a terminal and never under NO_COLOR;
 * the bar is drawn and cleared with carriage returns and spaces only, no escape codes.
 */
import {printable} from './diagnostics.js'

export interface ProgressOptions {
  tty: boolean
  color: boolean
  quiet: boolean
  write: (s: string) => void
}

export const useColor = (tty: boolean, env: NodeJS.ProcessEnv): boolean => tty && (env['NO_COLOR'] ?? '') === ''

export const paint = (on: boolean, code: number, s: string): string => (on ? `\u001b[${code}m${s}\u001b[0m` : s)

export class Progress {
  private done = 0
  /** Characters of the bar now on screen (0 = none). */
  private drawn = 0
  constructor(private readonly total: number, private readonly o: ProgressOptions) {}

  /** One note finished. `status` is a short word: ok, not met, error, up to date. */
  note(file: string, status: string, seconds: number): void {
    this.done++
    if (this.o.quiet) return
    if (this.o.tty) {
      const width = 24
      const filled = Math.round((this.done / this.total) * width)
      const bar = '█'.repeat(filled) + '░'.repeat(width - filled)
      const line = `${bar} ${this.done}/${this.total} notes`
      this.o.write(`\r${line}`)
      this.drawn = line.length
      if (this.done === this.total) { this.o.write('\n'); this.drawn = 0 }
    } else {
      this.o.write(`[${this.done}/${this.total}] ${status}: ${printable(file)} (${seconds.toFixed(2)} s)\n`)
    }
  }

  /** Clear the bar before other output (diagnostics) is written. */
  clear(): void {
    if (this.drawn > 0) this.o.write(`\r${' '.repeat(this.drawn)}\r`)
    this.drawn = 0
  }
}
