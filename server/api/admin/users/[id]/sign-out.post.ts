import { eq, sql } from 'drizzle-orm'

// Ends every session the user holds, on every device, at their next request.
export default defineEventHandler(async (event) => {
  await requireRole(event, 'admin')
  const { id } = parseParams(event, uuidParam)
  await useDb().transaction(async (tx) => {
    await findUserOr404(tx, id)
    await tx.update(schema.users).set({ sessionEpoch: sql`${schema.users.sessionEpoch} + 1` }).where(eq(schema.users.id, id))
    await audit(tx, event, { action: 'user.sessions-ended', entity: 'user', entityId: id })
  })
  return { ok: true }
})
