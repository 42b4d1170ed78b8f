import { eq, sql } from 'drizzle-orm'
import { passwordResetSchema } from '#shared/schemas/users'

// An admin sets a new password; the user's sessions end and their sign-in throttle is lifted.
export default defineEventHandler(async (event) => {
  await requireRole(event, 'admin')
  const { id } = parseParams(event, uuidParam)
  const { password } = await parseBody(event, passwordResetSchema)
  const passwordHash = await hashPassword(password)
  await useDb().transaction(async (tx) => {
    const before = await findUserOr404(tx, id)
    await tx.update(schema.users).set({ passwordHash, updatedAt: new Date(), sessionEpoch: sql`${schema.users.sessionEpoch} + 1` }).where(eq(schema.users.id, id))
    await tx.delete(schema.loginAttempts).where(eq(schema.loginAttempts.email, before.email))
    await audit(tx, event, { action: 'user.password-reset', entity: 'user', entityId: id })
  })
  return { ok: true }
})
