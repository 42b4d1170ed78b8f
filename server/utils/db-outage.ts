// Tells a database outage (the server is down, restarting, unreachable or out of connections) from any other
// error, so that the API answers 503 "try again" rather than 500 "something is wrong here".

/** What the API answers while PostgreSQL cannot be reached. */
export const DB_OUTAGE_MESSAGE = 'The database is not reachable right now; nothing was saved. Try again in a moment.'

// Network errors of the socket to PostgreSQL (Node's errno codes).
const NETWORK_CODES = new Set(['ECONNREFUSED', 'ECONNRESET', 'ETIMEDOUT', 'EHOSTUNREACH', 'ENETUNREACH', 'EPIPE', 'ENOTFOUND', 'EAI_AGAIN'])
// PostgreSQL SQLSTATEs (Appendix A of its manual): 57P01 admin_shutdown, 57P02 crash_shutdown,
// 57P03 cannot_connect_now (starting up or in recovery), 53300 too_many_connections; class 08 is connection exceptions.
const SQLSTATES = new Set(['57P01', '57P02', '57P03', '53300'])
// node-postgres and pg-pool say these in words, without a code.
const MESSAGES = [
  /connection terminated/i,
  /timeout exceeded when trying to connect/i,
  /client has encountered a connection error and is not queryable/i,
  /cannot use a pool after calling end/i,
  /the database system is (starting up|shutting down|in recovery mode)/i,
]

/** True when this error, or any error it wraps (drizzle and h3 keep the driver's error as `cause`), is an outage. */
export function isDatabaseUnavailable(error: unknown): boolean {
  const seen = new Set<unknown>()
  let e: unknown = error
  while (e && typeof e === 'object' && !seen.has(e)) {
    seen.add(e)
    const { code, message, errors } = e as { code?: unknown, message?: unknown, errors?: unknown }
    if (typeof code === 'string' && (NETWORK_CODES.has(code) || SQLSTATES.has(code) || /^08[0-9A-Z]{3}$/.test(code))) return true
    if (typeof message === 'string' && MESSAGES.some(re => re.test(message))) return true
    // Node reports a refused connection to a host with several addresses as an AggregateError.
    if (Array.isArray(errors) && errors.some(x => isDatabaseUnavailable(x))) return true
    e = (e as { cause?: unknown }).cause
  }
  return false
}
