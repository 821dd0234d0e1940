// Errors that mean "the database cannot be reached right now" (the server is down, restarting or the
// connection broke), as opposed to a query that failed on its own. postgres.js reports its connection
// errors with these codes; PostgreSQL's SQLSTATE class 08 and 57P01–57P03 say the same from the server
// (PostgreSQL manual, appendix A "Error Codes").
const connectionCodes = new Set([
  "ECONNREFUSED",
  "ECONNRESET",
  "EPIPE",
  "ETIMEDOUT",
  "EHOSTUNREACH",
  "ENOTFOUND",
  "CONNECTION_CLOSED",
  "CONNECTION_ENDED",
  "CONNECTION_DESTROYED",
  "CONNECT_TIMEOUT",
  "57P01", // admin_shutdown
  "57P02", // crash_shutdown
  "57P03", // cannot_connect_now (starting up or shutting down)
]);

/** Whether `error` (or an error it wraps, as Drizzle's query errors do) is a lost or refused connection. */
export function isConnectionError(error: unknown): boolean {
  for (let current = error, depth = 0; current && depth < 5; depth++) {
    const code = (current as { code?: unknown }).code;
    if (typeof code === "string" && (connectionCodes.has(code) || code.startsWith("08"))) return true;
    current = (current as { cause?: unknown }).cause;
  }
  return false;
}

/** A connection error as one line (its stack says nothing new); any other error as it is. */
export function describeDatabaseError(error: unknown): unknown {
  if (!isConnectionError(error)) return error;
  let current = error as { message?: string; code?: string; cause?: unknown };
  while (current.cause && !current.code) current = current.cause as typeof current;
  return `${current.message ?? String(current)}${current.code ? ` (${current.code})` : ""}`;
}
