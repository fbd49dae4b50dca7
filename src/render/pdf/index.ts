/**
 * `src/render`: the report tree (`ReportDocument`) to PDF bytes with pdfkit and
 * svg-to-pdfkit. This file only re-exports the public API.
 */
export {renderPdf, type RenderOptions, type RenderOutput} from './document.js'
export {loadFonts as parseFonts, type FontSet, type LoadedFonts} from './fonts.js'
export {parseTheme, type Theme, type CalloutKind, type PageName} from './theme.js'
