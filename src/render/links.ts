/**
 * Which link targets a report may carry, in the PDF and the Markdown report alike: http,
 * https and mailto only. Any other (`javascript:`, `file:`, `data:`, a relative path a
 * viewer would resolve on the reader's machine) is printed as the link's text alone.
 */
export const webLink = (url: string): string | null => (/^(?:https?:\/\/|mailto:)/i.test(url.trim()) ? url.trim() : null)
