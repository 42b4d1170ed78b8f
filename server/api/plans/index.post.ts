import { eq } from 'drizzle-orm'
import { planCreateSchema } from '#shared/schemas/plans'

export default defineEventHandler(async (event) => {
  const user = await requireRole(event)
  const input = await parseBody(event, planCreateSchema)
  const plan = await useDb().transaction(async (tx) => {
    const vessel = await tx.select({ id: schema.vessels.id }).from(schema.vessels).where(eq(schema.vessels.id, input.vesselId))
    if (!vessel.length) invalidInput([{ path: 'vesselId', message: 'no such vessel' }])
    const [row] = await tx.insert(schema.plans).values({ ...input, createdBy: user.id }).returning()
    await audit(tx, event, { action: 'plan.create', entity: 'plan', entityId: row!.id, newValues: row })
    return row!
  })
  setResponseStatus(event, 201)
  return plan
})
