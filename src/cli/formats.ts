/** Output formats of `build` (DESIGN §6 and the review workflow). */
export const FORMATS = ['pdf', 'json', 'md'] as const
export type Format = (typeof FORMATS)[number]
