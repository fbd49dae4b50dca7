/**
 * `--shard i/n`: the notes of a batch split over n CI jobs. A note belongs to shard
 * 1 + (hash of its path as listed, `/`-separated) mod n, so the split is stable from run
 * to run and machine to machine, needs no coordination, and moves only the notes added or
 * renamed. The shards are disjoint and together are the whole batch.
 */
import {createHash} from 'node:crypto'

export interface Shard {
  /** 1-based. */
  index: number
  count: number
}

/** `i/n` with 1 ≤ i ≤ n, or null when the text is not of that shape. */
export function parseShard(text: string): Shard | null {
  const m = /^([1-9]\d*)\/([1-9]\d*)$/.exec(text.trim())
  if (!m) return null
  const index = Number(m[1])
  const count = Number(m[2])
  return index <= count ? {index, count} : null
}

/** The shard (1-based) of a note path among `count`. */
export function shardOf(path: string, count: number): number {
  const h = createHash('sha256').update(path.replaceAll('\\', '/')).digest()
  return 1 + (h.readUInt32BE(0) % count)
}

/** The notes of `notes` in shard `shard`, order kept. */
export const inShard = (notes: readonly string[], shard: Shard): string[] =>
  notes.filter((n) => shardOf(n, shard.count) === shard.index)
