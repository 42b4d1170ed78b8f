// One body limit for every request, whatever its method and Content-Type: the body is read here, from the stream,
// up to the route's ceiling (server/utils/body-limit.ts) and handed to the route's parser; a declared Content-Length
// above the ceiling is refused before reading, and a chunked body is cut off as soon as it passes the ceiling.
// Runs before every other middleware (file order), so nothing parses an unbounded body.
import type { IncomingMessage, ServerResponse } from 'node:http'
import type { H3Event } from 'h3'

// After a refusal the rest of the body is read and thrown away, so that the client, still sending, gets to read the
// 413: until the answer is written, then for at most these bounds more, after which a connection still sending is cut.
// A body that ends within them leaves the connection open for the next request. (A `Connection: close` header, or
// closing our side, makes clients that are still sending, or that reuse the connection, fail before they read.)
const DRAIN_BYTES = 4 * 1024 * 1024
const DRAIN_MS = 2_000
const DRAIN_MAX_MS = 10_000

function discardRest(req: IncomingMessage, res: ServerResponse) {
  let drained = 0
  let answered = false
  const stop = () => {
    clearTimeout(timer)
    req.off('data', onData)
    if (!req.complete) req.socket?.destroy()
  }
  const onData = (chunk: Buffer) => {
    if (!answered) return
    drained += chunk.length
    if (drained > DRAIN_BYTES) stop()
  }
  let timer = setTimeout(stop, DRAIN_MAX_MS)
  timer.unref?.()
  res.once('finish', () => {
    answered = true
    clearTimeout(timer)
    timer = setTimeout(stop, DRAIN_MS)
    timer.unref?.()
  })
  req.on('data', onData).once('end', () => {
    clearTimeout(timer)
    req.off('data', onData)
  })
  req.resume()
}

function tooLarge(event: H3Event, limit: number, what: string) {
  discardRest(event.node.req, event.node.res)
  return createError({
    statusCode: 413,
    message: `The request body is larger than the ${formatBytes(limit)} accepted for ${what}. Nothing was changed.`,
    data: { limitBytes: limit },
  })
}

function readLimited(req: IncomingMessage, limit: number): Promise<Buffer | null> {
  return new Promise((resolve, reject) => {
    const chunks: Buffer[] = []
    let size = 0
    const done = () => {
      req.off('data', onData).off('end', onEnd).off('error', onError)
    }
    const onData = (chunk: Buffer) => {
      size += chunk.length
      if (size > limit) {
        done()
        resolve(null)
        return
      }
      chunks.push(chunk)
    }
    const onEnd = () => {
      done()
      resolve(Buffer.concat(chunks, size))
    }
    const onError = (err: Error) => {
      done()
      reject(err)
    }
    req.on('data', onData).on('end', onEnd).on('error', onError)
  })
}

// Only these methods have their bodies read by any route (h3's body readers refuse the others).
const PAYLOAD_METHODS = new Set(['POST', 'PUT', 'PATCH', 'DELETE'])

export default defineEventHandler(async (event) => {
  const req = event.node.req
  // A request this server makes to itself (error pages, server-side fetches) carries its body in memory, not a stream.
  if ('__unenv__' in req) return
  const length = req.headers['content-length']
  const chunked = req.headers['transfer-encoding'] !== undefined
  if (!chunked && (length === undefined || length.trim() === '0')) return
  const { limit, what } = await bodyCeiling(event)
  const declared = Number(length)
  if (length !== undefined && Number.isFinite(declared) && declared > limit) throw tooLarge(event, limit, what)
  // Nothing parses the body of a GET or HEAD; it is never buffered here.
  if (!PAYLOAD_METHODS.has(event.method)) return
  const body = await readLimited(req, limit)
  if (!body) throw tooLarge(event, limit, what)
  // h3's body readers (readBody, readRawBody, readMultipartFormData) take this buffer instead of the stream.
  event._requestBody = body as unknown as BodyInit
})
