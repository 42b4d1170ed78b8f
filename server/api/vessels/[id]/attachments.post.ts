// Upload photos (JPEG, PNG, WebP) and certificates (PDF) for a servicing record (technician), as
// multipart/form-data. Each file is checked from its content and the size limit of the lab policy,
// stored under a random key, and returned with its id; the record then names the ids (attachmentIds).
export default defineEventHandler(async (event) => {
  const user = await requireRole(event)
  const { id } = parseParams(event, vesselIdParam)
  const db = useDb()
  const vessel = await findVesselOr404(db, id)
  const files = await readCheckedUploads(event, (await getPolicy()).uploadMaxBytes)
  const checked = files.map(f => ({ ...f, key: newStorageKey(vessel.id, f.type) }))

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
