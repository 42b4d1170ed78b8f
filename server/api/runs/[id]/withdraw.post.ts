import { eq } from 'drizzle-orm'
import { z } from 'zod'
import { runActRefusal } from '#shared/domain/run-lifecycle'

const body = z.object({ reason: z.string().trim().max(1000).default('') }).strict()

// A run that will not be fired is withdrawn, never deleted: the record stays.
export default defineEventHandler(async (event) => {
  await requireRole(event)
  const { id } = parseParams(event, idParam)
  const { reason } = await parseBody(event, body)
  const policy = await getPolicy()
  const run = await useDb().transaction(async (tx) => {
    const before = await findRunOr404(tx, id, true)
    const refusal = runActRefusal('withdraw', before.status, before.sampleCode)
    if (refusal) throw createError({ statusCode: 409, message: refusal, data: { reason: 'run-status', status: before.status } })
    const [row] = await tx.update(schema.runs).set({ status: 'withdrawn', statusReason: null, updatedAt: new Date() }).where(eq(schema.runs.id, id)).returning()
    await audit(tx, event, { action: 'run.withdraw', entity: 'run', entityId: id, oldValues: { status: before.status }, newValues: { status: 'withdrawn' }, reason })
    await settleSampleStatus(tx, event, before.sampleId, `withdrawal of ${before.sampleCode} #${before.seq}`, policy)
    return row!
  })
  return runView(run)
})
