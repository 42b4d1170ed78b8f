import { eq } from 'drizzle-orm'
import { passwordResetSchema } from '#shared/schemas/users'

// An admin sets a new password; the user's sessions end and their sign-in throttle is lifted.
export default defineEventHandler(async (event) => {
  await requireRole(event)
  const { id } = parseParams(event, uuidParam)
  const { password } = await parseBody(event, passwordResetSchema)
  const [target] = await useDb().select({ email: schema.users.email, name: schema.users.name }).from(schema.users).where(eq(schema.users.id, id))
  if (!target) throw createError({ statusCode: 404, message: 'No such user.' })
  await assertStrongPassword(password, 'password', [target.email, target.name])
  const passwordHash = await inHashSlot(() => hashPassword(password))
  await useDb().transaction(async (tx) => {
    const before = await findUserOr404(tx, id)
    await tx.update(schema.users).set({ passwordHash, updatedAt: new Date() }).where(eq(schema.users.id, id))
    const sessionsEnded = await endUserSessions(tx, id, 'password-reset')
    await tx.delete(schema.loginAttempts).where(eq(schema.loginAttempts.email, before.email))
    await audit(tx, event, { action: 'user.password-reset', entity: 'user', entityId: id, newValues: { sessionsEnded } })
  })
  return { ok: true }
})
