/**
 * The `ampreview` package: the note reader, the engine, the rules and the report builder
 * as a library (the CLI is `ampreview` on the PATH). The engine alone is `ampreview/engine`.
 */
export * from './engine/index.js'
export {parseNote} from './note/index.js'
export type * from './note/types.js'
export {runRules} from './rules/index.js'
export type * from './rules/types.js'
export {evaluateNote, type StageEvaluation} from './evaluate/index.js'
export {buildReport} from './report/build.js'
export {jsonStage} from './results/json.js'
export type * from './report/types.js'
export {renderPdf} from './render/pdf/index.js'
