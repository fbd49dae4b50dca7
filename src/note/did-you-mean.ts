/**
 * "Did you mean" hints: the nearest candidate by edit distance (Levenshtein, with an
 * adjacent swap counting as one edit), when it is near enough to be a likely typo.
 */

/** Edit distance between `a` and `b` (insert, delete, substitute, swap adjacent). */
export function editDistance(a: string, b: string): number {
  const rows: number[][] = []
  for (let i = 0; i <= a.length; i++) {
    const row: number[] = [i]
    for (let j = 1; j <= b.length; j++) {
      if (i === 0) {
        row.push(j)
        continue
      }
      const prev = rows[i - 1] ?? []
      const cost = a[i - 1] === b[j - 1] ? 0 : 1
      let d = Math.min((prev[j] ?? 0) + 1, (row[j - 1] ?? 0) + 1, (prev[j - 1] ?? 0) + cost)
      if (i > 1 && j > 1 && a[i - 1] === b[j - 2] && a[i - 2] === b[j - 1]) d = Math.min(d, (rows[i - 2]?.[j - 2] ?? 0) + 1)
      row.push(d)
    }
    rows.push(row)
  }
  return rows[a.length]?.[b.length] ?? Math.max(a.length, b.length)
}

/**
 * The candidate nearest to `word`, or null when none is within
 * max(1, ⌊40 % of the longer length⌋) edits (case ignored).
 */
export function didYouMean(word: string, candidates: Iterable<string>): string | null {
  let best: string | null = null
  let bestDistance = Infinity
  const w = word.toLowerCase()
  for (const c of candidates) {
    const d = editDistance(w, c.toLowerCase())
    if (d < bestDistance) {
      best = c
      bestDistance = d
    }
  }
  if (best === null) return null
  const limit = Math.max(1, Math.floor(0.4 * Math.max(w.length, best.length)))
  return bestDistance <= limit && best !== word ? best : null
}
