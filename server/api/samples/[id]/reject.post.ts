import { eq } from 'drizzle-orm'
import { sampleRejectSchema } from '#shared/schemas/samples'

// Refusal at receipt (leaking container, too little material, an item the lab may not fire): only a waiting sample.
export default defineEventHandler(async (event) => {
  await requireRole(event)
  const { id } = parseParams(event, idParam)
  const { reason } = await parseBody(event, sampleRejectSchema)
  const row = await useDb().transaction(async (tx) => {
    const sample = await findSampleOr404(tx, id, true)
    if (sample.status !== 'received') throw createError({ statusCode: 409, message: `${sample.labCode} is ${sample.status}; only a sample still waiting in the queue can be rejected at receipt.` })
    const [updated] = await tx.update(schema.samples).set({ status: 'rejected', rejectionReason: reason, updatedAt: new Date() }).where(eq(schema.samples.id, id)).returning()
    await audit(tx, event, { action: 'sample.reject', entity: 'sample', entityId: id, oldValues: { status: sample.status }, newValues: { status: 'rejected' }, reason })
    return updated!
  })
  return sampleView(row)
})
