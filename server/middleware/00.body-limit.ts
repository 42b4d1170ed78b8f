// One body limit for every request, whatever its method and Content-Type: the body is read here, from the stream,
// up to the route's ceiling (server/utils/body-limit.ts) and handed to the route's parser; a declared Content-Length
// above the ceiling is refused before reading, and a chunked body is cut off as soon as it passes the ceiling.
// Runs before every other middleware (file order), so nothing parses an unbounded body.
import type { IncomingMessage } from 'node:http'
import type { H3Event } from 'h3'

function tooLarge(event: H3Event, limit: number, what: string) {
  // The rest of the body is never read: the connection closes after this answer.
  setResponseHeader(event, 'Connection', 'close')
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
        req.pause()
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

export default defineEventHandler(async (event) => {
  const req = event.node.req
  const length = req.headers['content-length']
  const chunked = req.headers['transfer-encoding'] !== undefined
  if (!chunked && (length === undefined || length.trim() === '0')) return
  const { limit, what } = await bodyCeiling(event)
  const declared = Number(length)
  if (length !== undefined && Number.isFinite(declared) && declared > limit) throw tooLarge(event, limit, what)
  const body = await readLimited(req, limit)
  if (!body) throw tooLarge(event, limit, what)
  // h3's body readers (readBody, readRawBody, readMultipartFormData) take this buffer instead of the stream.
  event._requestBody = body as unknown as BodyInit
})
