import { randomUUID } from 'node:crypto'

// Photos of a sample as it arrived (container, label, condition), multipart/form-data; stored linked to the sample.
export default defineEventHandler(async (event) => {
  const user = await requireRole(event)
  const { id } = parseParams(event, idParam)
  const sample = await findSampleOr404(useDb(), id)
  const files = await readCheckedUploads(event, (await getPolicy()).uploadMaxBytes, { maxFiles: 4, imagesOnly: true })
  const storage = await uploadStorage()
  const stored: string[] = []
  try {
    const keyed = files.map(f => ({ ...f, key: `sample:${sample.id}:${randomUUID()}.${f.type.ext}` }))
    for (const f of keyed) {
      await storage.setItemRaw(f.key, f.data)
      stored.push(f.key)
    }
    const rows = await useDb().transaction(async (tx) => {
      const inserted = await tx.insert(schema.attachments).values(keyed.map(f => ({
        sampleId: sample.id, storageKey: f.key, fileName: f.fileName, contentType: f.type.contentType, sizeBytes: f.data.length, uploadedBy: user.id,
      }))).returning()
      await audit(tx, event, { action: 'sample.photo', entity: 'sample', entityId: sample.id, newValues: inserted.map(r => ({ id: r.id, fileName: r.fileName, contentType: r.contentType, sizeBytes: r.sizeBytes })) })
      return inserted
    })
    setResponseStatus(event, 201)
    return rows.map(attachmentView)
  }
  catch (err) {
    await Promise.allSettled(stored.map(k => storage.removeItem(k)))
    throw err
  }
})
