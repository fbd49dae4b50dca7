/**
 * Render warnings: collected in order, each distinct message once. `renderPdf` returns
 * them; the CLI decides whether they fail the build.
 */
export interface Warnings {
  add(message: string): void
  list(): string[]
}

export function createWarnings(): Warnings {
  const seen = new Set<string>()
  const order: string[] = []
  return {
    add(message) {
      if (seen.has(message)) return
      seen.add(message)
      order.push(message)
    },
    list: () => [...order],
  }
}

/** A sink for measuring passes, whose messages the real pass raises again. */
export function silentWarnings(): Warnings {
  return {add: () => undefined, list: () => []}
}
