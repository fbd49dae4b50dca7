// After bundling: the SHA-256 of every file of dist/bin (names and bytes, in name order), written
// to dist/bin/build-id.txt. The build cache keys on it, so a rebuilt command with other code
// never reuses a PDF made by the earlier one (the version string alone does not change).
// `node scripts/build-id.mjs DIR` does the same for another folder (the tests use it).
import {createHash} from 'node:crypto'
import {readdirSync, readFileSync, writeFileSync} from 'node:fs'
import {join} from 'node:path'

const dir = process.argv[2] ?? join(import.meta.dirname, '..', 'dist', 'bin')
const h = createHash('sha256')
for (const name of readdirSync(dir).filter((n) => n !== 'build-id.txt').sort()) {
  const bytes = readFileSync(join(dir, name))
  h.update(`${name}\0${bytes.byteLength}\0`).update(bytes)
}
writeFileSync(join(dir, 'build-id.txt'), `${h.digest('hex')}\n`)
