// One body limit for every request, whatever its method and Content-Type: the body is read here, from the stream,
// up to the route's ceiling (server/utils/body-limit.ts) and handed to the route's parser; a declared Content-Length
// above the ceiling is refused before reading, and a chunked body is cut off as soon as it passes the ceiling.
// Runs before every other middleware (file order), so nothing parses an unbounded body.
import type { IncomingMessage } from 'node:http'
import type { H3Event } from 'h3'

// Before a refusal is answered, the rest of the body is read and thrown away (never kept), up to these bounds: a body
// that ends within them gets a clean 413 on a connection that stays open. Answering while the client is still sending
// makes Node close the connection under it, and the client may fail on its next write before it reads the answer; so a
// body still coming past the bounds gets the 413 with the connection closed.
const DRAIN_BYTES = 8 * 1024 * 1024
const DRAIN_MS = 3_000

/** Reads and discards the rest of the body; true when it ended within the bounds. */
function discardRest(req: IncomingMessage): Promise<boolean> {
  if (req.complete) return Promise.resolve(true)
  return new Promise((resolve) => {
    let drained = 0
    const finish = (ended: boolean) => {
      clearTimeout(timer)
      req.off('data', onData).off('end', onEnd).off('error', onEnd)
      resolve(ended)
    }
    const onData = (chunk: Buffer) => {
      drained += chunk.length
      if (drained > DRAIN_BYTES) finish(false)
    }
    const onEnd = () => finish(req.complete)
    const timer = setTimeout(() => finish(false), DRAIN_MS)
    timer.unref?.()
    req.on('data', onData).once('end', onEnd).once('error', onEnd)
    req.resume()
  })
}

async function tooLarge(event: H3Event, limit: number, what: string) {
  if (!await discardRest(event.node.req)) setResponseHeader(event, 'Connection', 'close')
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
  if (length !== undefined && Number.isFinite(declared) && declared > limit) throw await tooLarge(event, limit, what)
  // Nothing parses the body of a GET or HEAD; it is never buffered here.
  if (!PAYLOAD_METHODS.has(event.method)) return
  const body = await readLimited(req, limit)
  if (!body) throw await tooLarge(event, limit, what)
  // h3's body readers (readBody, readRawBody, readMultipartFormData) take this buffer instead of the stream.
  event._requestBody = body as unknown as BodyInit
})
