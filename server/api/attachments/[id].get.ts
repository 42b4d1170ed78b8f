import { eq } from 'drizzle-orm'
import { z } from 'zod'

const params = z.object({ id: z.string().uuid('an attachment id (UUID)') })

// Serves a stored photo or certificate to signed-in users only. The type is the one detected at upload;
// PDFs are always downloaded (never rendered inside the app), images shown inline, and nothing is sniffed.
export default defineEventHandler(async (event) => {
  const user = await requireUser(event)
  const { id } = parseParams(event, params)
  const [row] = await useDb().select().from(schema.attachments).where(eq(schema.attachments.id, id))
  // An upload not yet part of a record is visible to its uploader only.
  if (!row || (row.serviceId === null && row.sampleId === null && row.uploadedBy !== user.id)) throw createError({ statusCode: 404, message: 'No such file.' })
  const raw = await (await uploadStorage()).getItemRaw(row.storageKey)
  if (!raw) {
    console.error(`[uploads] attachment ${row.id} has no stored file at ${row.storageKey}`)
    throw createError({ statusCode: 404, message: 'The stored file is missing; tell the admin.' })
  }
  const body = Buffer.isBuffer(raw) ? raw : Buffer.from(raw as ArrayBuffer)
  const image = row.contentType.startsWith('image/')
  setResponseHeaders(event, {
    'Content-Type': row.contentType,
    'Content-Length': String(body.length),
    'Content-Disposition': `${image ? 'inline' : 'attachment'}; filename="${row.fileName.replace(/["\\]/g, '_')}"`,
    'X-Content-Type-Options': 'nosniff',
    'Content-Security-Policy': 'default-src \'none\'; img-src \'self\'; sandbox',
    'Cache-Control': 'no-store',
  })
  return body
})
