// Upload photos (JPEG, PNG, WebP) and certificates (PDF) for a servicing record (technician), as
// multipart/form-data. Each file is checked from its content and the size limit of the lab policy,
// stored under a random key, and returned with its id; the record then names the ids (attachmentIds).
export default defineEventHandler(async (event) => {
  const user = await requireRole(event, 'technician')
  const { id } = parseParams(event, vesselIdParam)
  const db = useDb()
  const vessel = await findVesselOr404(db, id)
  const policy = await getPolicy()
  const limit = policy.uploadMaxBytes
  const mb = (n: number) => `${(n / 1_048_576).toLocaleString('en-GB', { maximumFractionDigits: 2 })} MB`

  if (!(getRequestHeader(event, 'content-type') ?? '').toLowerCase().startsWith('multipart/form-data')) {
    throw createError({ statusCode: 415, message: 'Send the files as multipart/form-data.' })
  }
  // Refuse an oversize request before reading it: at most MAX_FILES_PER_UPLOAD files of the limit each, plus the form's framing.
  const declared = Number(getRequestHeader(event, 'content-length'))
  if (Number.isFinite(declared) && declared > limit * MAX_FILES_PER_UPLOAD + 65_536) {
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
  if (!files.length) invalidInput([{ path: 'files', message: 'choose at least one photo or certificate' }])
  if (files.length > MAX_FILES_PER_UPLOAD) invalidInput([{ path: 'files', message: `at most ${MAX_FILES_PER_UPLOAD} files at once` }])

  // Every file is checked before any is stored: a refused upload stores nothing.
  const checked = files.map((f, i) => {
    const path = `files.${i}`
    if (f.data.length > limit) {
      throw createError({ statusCode: 413, message: `${f.filename || 'The file'} is ${mb(f.data.length)}; the limit is ${mb(limit)}.`, data: { fields: [{ path, message: `at most ${mb(limit)}` }] } })
    }
    if (!f.data.length) invalidInput([{ path, message: 'the file is empty' }])
    const type = detectUploadType(f.data)
    if (!type) invalidInput([{ path, message: 'not a JPEG, PNG or WebP photo or a PDF certificate (judged from the file\'s content, not its name)' }])
    return { data: f.data, type, fileName: sanitizeFileName(f.filename, type), key: newStorageKey(vessel.id, type) }
  })

  const storage = await uploadStorage()
  const stored: string[] = []
  try {
    for (const c of checked) {
      await storage.setItemRaw(c.key, c.data)
      stored.push(c.key)
    }
    const rows = await db.transaction(async (tx) => {
      const inserted = await tx.insert(schema.attachments).values(checked.map(c => ({
        storageKey: c.key, fileName: c.fileName, contentType: c.type.contentType, sizeBytes: c.data.length, uploadedBy: user.id,
      }))).returning()
      await audit(tx, event, {
        action: 'attachment.upload',
        entity: 'vessel',
        entityId: vessel.id,
        newValues: inserted.map(r => ({ id: r.id, fileName: r.fileName, contentType: r.contentType, sizeBytes: r.sizeBytes })),
      })
      return inserted
    })
    setResponseStatus(event, 201)
    return rows.map(attachmentView)
  }
  catch (err) {
    // Nothing half-done: files stored for a request that failed are removed again.
    await Promise.allSettled(stored.map(k => storage.removeItem(k)))
    throw err
  }
})
