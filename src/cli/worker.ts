/**
 * A batch worker thread: loads the fonts once, then processes the notes the main thread
 * sends, one at a time, and posts back each note's outcome.
 */
import {parentPort} from 'node:worker_threads'
import {failedOutcome, processNote, type NoteOutcome, type Resources, type RunOptions} from './pipeline.js'
import {buildId, lazyFaces, lazyFonts, toolVersion} from './resources.js'

export interface WorkerRequest {
  id: number
  path: string
  opts: RunOptions
}

export interface WorkerReply {
  id: number
  outcome: NoteOutcome
}

const port = parentPort
if (port === null) throw new Error('worker.ts runs only as a worker thread')
const fonts = lazyFonts()
const resources: Promise<Resources> = Promise.all([toolVersion(), buildId()]).then(([version, id]) => ({fonts, faces: lazyFaces(fonts), version, buildId: id, templates: new Map()}))

port.on('message', (req: WorkerRequest) => {
  void resources
    .then((res) => processNote(req.path, res, req.opts))
    .catch((error: unknown) => failedOutcome(req.path, `internal error: ${error instanceof Error ? error.message : String(error)}`))
    .then((outcome) => port.postMessage({id: req.id, outcome} satisfies WorkerReply))
})
