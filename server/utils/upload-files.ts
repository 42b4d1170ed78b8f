// Reads a multipart upload and checks every file (size from the lab policy, type from the content) before any is stored.
import type { H3Event } from 'h3'

export interface CheckedUpload { data: Buffer, type: UploadType, fileName: string }

/** Every file checked before any is stored: a refused upload stores nothing. `imagesOnly` refuses PDFs. */
export async function readCheckedUploads(event: H3Event, limit: number, opts: { maxFiles?: number, imagesOnly?: boolean } = {}): Promise<CheckedUpload[]> {
  const maxFiles = opts.maxFiles ?? MAX_FILES_PER_UPLOAD
  const what = opts.imagesOnly ? 'a JPEG, PNG or WebP photo' : 'a JPEG, PNG or WebP photo or a PDF certificate'
  const mb = (n: number) => `${(n / 1_048_576).toLocaleString('en-GB', { maximumFractionDigits: 2 })} MB`
  if (!(getRequestHeader(event, 'content-type') ?? '').toLowerCase().startsWith('multipart/form-data')) {
    throw createError({ statusCode: 415, message: 'Send the files as multipart/form-data.' })
  }
  const declared = Number(getRequestHeader(event, 'content-length'))
  if (Number.isFinite(declared) && declared > limit * maxFiles + 65_536) {
    throw createError({ statusCode: 413, message: `The upload is larger than the limit of ${mb(limit)} per file.`, data: { fields: [{ path: 'files', message: `at most ${mb(limit)} per file` }] } })
  }
  let parts: Awaited<ReturnType<typeof readMultipartFormData>>
  try {
    parts = await readMultipartFormData(event)
  }
  catch {
    throw createError({ statusCode: 400, message: 'The upload could not be read as multipart/form-data.' })
  }
  const files = (parts ?? []).filter(p => p.filename !== undefined)
  if (!files.length) invalidInput([{ path: 'files', message: opts.imagesOnly ? 'choose a photo' : 'choose at least one photo or certificate' }])
  if (files.length > maxFiles) invalidInput([{ path: 'files', message: `at most ${maxFiles} files at once` }])
  return files.map((f, i) => {
    const path = `files.${i}`
    if (f.data.length > limit) throw createError({ statusCode: 413, message: `${f.filename || 'The file'} is ${mb(f.data.length)}; the limit is ${mb(limit)}.`, data: { fields: [{ path, message: `at most ${mb(limit)}` }] } })
    if (!f.data.length) invalidInput([{ path, message: 'the file is empty' }])
    const type = detectUploadType(f.data)
    if (!type || (opts.imagesOnly && !type.image)) invalidInput([{ path, message: `not ${what} (judged from the file's content, not its name)` }])
    return { data: f.data, type, fileName: sanitizeFileName(f.filename, type) }
  })
}
