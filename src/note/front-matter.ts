/**
 * The front matter (DESIGN §3) to `DocumentMeta`. Every key is optional; `status` defaults
 * to draft. `reviewers` is a list of "Name", "Name (Role)" or `{name, role}` (role default
 * "Reviewer"); `context` is a list of hazard contexts (a single word is taken as a list of
 * one). Unknown keys are warnings with a did-you-mean hint, and are ignored.
 */
import type {Point} from 'unist'
import {DOCUMENT_STATUSES, HAZARD_CONTEXTS, type DocumentMeta, type HazardContext, type Reviewer} from './types.js'
import {describeValue, readYaml, type Field, type FieldValue} from './block-yaml.js'
import type {Reporter} from './diagnostics.js'
import {didYouMean} from './did-you-mean.js'
import {META_KEYS} from './keys.js'
import {noteMessages} from './messages.js'
import type {PointMapper} from './place.js'
import {choiceOf} from './values.js'

/** Role given to a reviewer written without one. */
export const DEFAULT_ROLE = 'Reviewer'

/** Metadata of a note without front matter. */
export const emptyMeta = (): DocumentMeta => ({
  title: null, document: null, revision: null, date: null, author: null, reviewers: [],
  project: null, status: 'draft', context: [], template: null
})

type TextKey = 'title' | 'document' | 'revision' | 'date' | 'author' | 'project' | 'template'
const TEXT_KEYS: readonly TextKey[] = ['title', 'document', 'revision', 'date', 'author', 'project', 'template']

const textOf = (field: Field, report: Reporter): string | null => {
  const v = field.value
  if (v.type === 'scalar') return v.text === null ? null : v.text.trim()
  report.error(noteMessages.metaNotText(field.key, describeValue(v)), v.at, 'front-matter')
  return null
}

function reviewerOf(item: FieldValue, report: Reporter): Reviewer | null {
  if (item.type === 'scalar') {
    const text = (item.text ?? '').trim()
    const m = /^(.*?)\s*\(([^()]*)\)$/.exec(text)
    return m ? {name: (m[1] ?? '').trim(), role: (m[2] ?? '').trim() || DEFAULT_ROLE} : {name: text, role: DEFAULT_ROLE}
  }
  if (item.type === 'map') {
    const r: Reviewer = {name: '', role: DEFAULT_ROLE}
    for (const f of item.fields) {
      if (f.key !== 'name' && f.key !== 'role') {
        report.warn(noteMessages.unknownReviewerKey(f.key), f.keyAt, 'front-matter')
        continue
      }
      const text = textOf(f, report)
      if (f.key === 'name') r.name = text ?? ''
      else r.role = text || DEFAULT_ROLE
    }
    return r
  }
  report.error(noteMessages.badReviewer(describeValue(item)), item.at, 'front-matter')
  return null
}

const pointOfValue = (v: FieldValue): Point => (v.type === 'scalar' ? v.at(0) : v.at)

function listOf(field: Field, report: Reporter): FieldValue[] | null {
  const v = field.value
  if (v.type === 'seq') return v.items
  if (v.type === 'scalar' && v.text === null) return []
  report.error(noteMessages.metaNotList(field.key, describeValue(v)), pointOfValue(v), 'front-matter')
  return null
}

/**
 * Read the front matter's YAML text.
 * @param map
 *   Maps a place in `text` to the Markdown file (see `place.ts`).
 */
export function readFrontMatter(text: string, map: PointMapper, report: Reporter): DocumentMeta {
  const meta = emptyMeta()
  const {fields} = readYaml(text, map, 'front matter', report)
  for (const field of fields) {
    const key = field.key
    if ((TEXT_KEYS as readonly string[]).includes(key)) {
      meta[key as TextKey] = textOf(field, report)
    } else if (key === 'status') {
      meta.status = choiceOf(field, DOCUMENT_STATUSES, report) ?? meta.status
    } else if (key === 'reviewers') {
      for (const item of listOf(field, report) ?? []) {
        const r = reviewerOf(item, report)
        if (r !== null) meta.reviewers.push(r)
      }
    } else if (key === 'context') {
      const items = field.value.type === 'scalar' && field.value.text !== null ? [field.value] : listOf(field, report) ?? []
      for (const item of items) {
        const c = choiceOf<HazardContext>({...field, value: item}, HAZARD_CONTEXTS, report)
        if (c !== null && !meta.context.includes(c)) meta.context.push(c)
      }
    } else {
      const suggestion = didYouMean(key, META_KEYS)
      report.warn(noteMessages.unknownMetaKey(key, suggestion), field.keyAt, 'front-matter', {
        actual: key, ...(suggestion ? {expected: [suggestion]} : {})
      })
    }
  }
  return meta
}
