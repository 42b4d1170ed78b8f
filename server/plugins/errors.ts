// The one place that turns unexpected errors into answers. A database outage is a 503 that says nothing
// was saved; any other unexpected error is a 500 with the request id and no detail (the log keeps the detail).
// Expected errors (createError with a 4xx) keep the answer Nitro and Nuxt give them.
import { randomUUID } from 'node:crypto'
import { STATUS_CODES } from 'node:http'
import type { H3Error, H3Event } from 'h3'
import type pg from 'pg'

/** Seconds a client should wait before retrying while the database is away. */
const RETRY_AFTER_S = 5
// The same outage is logged once every few seconds, not once per request.
let lastOutageLog = 0

function sendJson(event: H3Event, statusCode: number, statusMessage: string, body: Record<string, unknown>) {
  setResponseStatus(event, statusCode, statusMessage)
  setResponseHeaders(event, { 'Content-Type': 'application/json', 'Cache-Control': 'no-store' })
  return send(event, JSON.stringify({ error: true, statusCode, statusMessage, ...body }))
}

export default defineNitroPlugin((nitroApp) => {
  // node-postgres emits 'error' on a checked-out client (a transaction in progress) whose connection drops; with no
  // listener that is an uncaught exception. The statement fails as well and is answered above with a 503, and the
  // pool discards the broken client when it is released, so the event needs no more than a listener.
  try {
    (useDb() as unknown as { $client?: pg.Pool }).$client?.on('connect', client => client.on('error', () => {}))
  }
  catch { /* no database configured: useDb() answers 503 per request */ }

  const original = nitroApp.h3App.options.onError
  nitroApp.h3App.options.onError = async (error: H3Error, event: H3Event) => {
    const requestId = event.context.requestId ?? randomUUID()
    if (!event.node.res.headersSent) setResponseHeader(event, 'X-Request-Id', requestId)
    const api = event.path.startsWith('/api/')

    if (isDatabaseUnavailable(error)) {
      if (Date.now() - lastOutageLog > 5_000) {
        lastOutageLog = Date.now()
        const cause = (error.cause as Error | undefined)?.cause ?? error.cause ?? error
        console.error(`[db] unreachable, answering 503 (request ${requestId}, ${event.method} ${event.path.split('?')[0]}): ${(cause as Error)?.message ?? String(cause)}`)
      }
      if (!event.node.res.headersSent) setResponseHeader(event, 'Retry-After', RETRY_AFTER_S)
      if (api && !event.handled) return sendJson(event, 503, 'Service Unavailable', { message: DB_OUTAGE_MESSAGE, data: { requestId } })
      // Pages show Nuxt's error page with the same words.
      return original?.(createError({ statusCode: 503, statusMessage: 'Service Unavailable', message: DB_OUTAGE_MESSAGE, data: { requestId } }), event)
    }

    const status = error.statusCode ?? 500
    if (api && status >= 500 && (error.unhandled || error.fatal) && !event.handled) {
      console.error(`[error] request ${requestId} ${event.method} ${event.path.split('?')[0]}:`, error.cause ?? error)
      return sendJson(event, 500, 'Internal Server Error', {
        message: `Something went wrong on the server and the request was not completed. Quote request ${requestId} when you report it.`,
        data: { requestId },
      })
    }
    // Nitro calls every error without its own status text a "Server Error", even a 401 or 403.
    if (!error.statusMessage && STATUS_CODES[status]) error.statusMessage = STATUS_CODES[status]
    return original?.(error, event)
  }
})
