/**
 * Resolves after the event loop has run once more (timers, I/O, other requests): awaited between the
 * chunks of a long computation so that it never holds the server for long. No "server-only": the
 * benchmark measures the upload's parse with it.
 */
export const yieldToEventLoop = (): Promise<void> => new Promise((resolve) => setImmediate(resolve));
