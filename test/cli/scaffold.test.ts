import {describe, expect, it} from 'vitest'
import {readdirSync, readFileSync, symlinkSync} from 'node:fs'
import {join} from 'node:path'
import {TOPOLOGIES} from '../../src/engine/types.js'
import {runCli, tempNotes} from './helpers.js'
import {USAGE} from '../../src/cli/args.js'

describe('new', () => {
  it.each(TOPOLOGIES)('writes a %s note that checks without errors, meets its own requirements and passes --strict', (topology) => {
    const dir = tempNotes({})
    const file = join(dir, 'designs', `${topology}.md`)
    const made = runCli(['new', file, '--topology', topology])
    expect(made.status).toBe(0)
    expect(made.stdout.trim()).toBe(file)
    expect(readFileSync(file, 'utf8')).toContain(`topology: ${topology}`)
    const r = runCli(['check', file])
    expect(r.stderr).not.toMatch(/: error: /)
    expect(r.stderr).not.toMatch(/Requirement .* not met/)
    expect(r.status).toBe(0)
    // A starting note raises no warning or caution of its own: it enters an operating range and
    // the over-temperature bias currents, so no drift term is zero by default (--strict fails on any).
    const strict = runCli(['check', file, '--strict'])
    expect(strict.stderr).not.toMatch(/: (error|warning): /)
    expect(strict.status).toBe(0)
  })

  it('writes a non-inverting note when no topology is given', () => {
    const file = join(tempNotes({}), 'n.md')
    expect(runCli(['new', file]).status).toBe(0)
    expect(readFileSync(file, 'utf8')).toContain('topology: noninverting')
  })

  it('refuses to overwrite an existing file, and leaves it and its folder as they were', () => {
    const dir = tempNotes({'mine.md': '# My own work\n'})
    const r = runCli(['new', join(dir, 'mine.md'), '--topology', 'follower'])
    expect(r.status).toBe(2)
    expect(r.stderr).toContain(`${join(dir, 'mine.md')} already exists`)
    expect(readFileSync(join(dir, 'mine.md'), 'utf8')).toBe('# My own work\n')
    expect(readdirSync(dir)).toEqual(['mine.md'])
  })

  it('refuses an unknown topology with a usage error', () => {
    const dir = tempNotes({})
    const r = runCli(['new', join(dir, 'n.md'), '--topology', 'sideways'])
    expect(r.status).toBe(2)
    expect(r.stderr).toContain('Unexpected topology `sideways`')
    expect(readdirSync(dir)).toEqual([])
  })

  it('refuses to replace a dangling symbolic link', () => {
    const dir = tempNotes({})
    symlinkSync(join(dir, 'elsewhere.md'), join(dir, 'n.md'))
    expect(runCli(['new', join(dir, 'n.md')]).status).toBe(2)
    expect(readdirSync(dir)).toEqual(['n.md'])
  })
})

describe('new in the usage text and the README', () => {
  it('lists every topology `new` can write', () => {
    const list = `--topology ${TOPOLOGIES.join('|')}`
    expect(USAGE).toContain(list)
    expect(readFileSync(join(import.meta.dirname, '..', '..', 'README.md'), 'utf8')).toContain(list)
  })
})
