import {describe, expect, it} from 'vitest'
import {noteMessages} from '../../src/note/index.js'
import {noteOf} from './helpers.js'

const meta = (fm: string) => noteOf(`---\n${fm}\n---\n\nText.\n`)

describe('front matter', () => {
  it('defaults status to draft and lists to empty', () => {
    const {note, diagnostics} = meta('title: Only a title')
    expect(diagnostics).toEqual([])
    expect(note.meta).toMatchObject({title: 'Only a title', status: 'draft', reviewers: [], context: []})
  })

  it('keeps numbers as written (`revision: 1.10`)', () => {
    expect(meta('revision: 1.10').note.meta.revision).toBe('1.10')
  })

  it('reads reviewers written three ways', () => {
    const {note} = meta('reviewers:\n  - Ann Lee\n  - Bo Varga (Approver)\n  - {name: Cy Dunn, role: Quality}')
    expect(note.meta.reviewers).toEqual([
      {name: 'Ann Lee', role: 'Reviewer'},
      {name: 'Bo Varga', role: 'Approver'},
      {name: 'Cy Dunn', role: 'Quality'}
    ])
  })

  it('takes a single context word as a list of one', () => {
    expect(meta('context: mains-connected').note.meta.context).toEqual(['mains-connected'])
  })

  it('refuses reviewers that are not a list, at the value', () => {
    expect(meta('reviewers: Ann Lee').diagnostics).toEqual([`2:12: error: ${noteMessages.metaNotList('reviewers', 'value')}`])
  })

  it('refuses an unknown status with a hint', () => {
    expect(meta('status: aproved').diagnostics).toEqual([
      `2:9: error: ${noteMessages.unknownChoice('status', 'aproved', ['draft', 'for-review', 'approved'], 'approved')}`
    ])
  })
})
