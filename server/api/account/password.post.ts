import { eq } from 'drizzle-orm'
import { passwordChangeSchema } from '#shared/schemas/users'

// A user changes their own password: the current one is checked under the sign-in throttle, the new one must be
// strong; every other session of the user ends, this one stays signed in.
export default defineEventHandler(async (event) => {
  const user = await requireUser(event)
  const { currentPassword, newPassword } = await parseBody(event, passwordChangeSchema)
  await assertStrongPassword(newPassword, 'newPassword', [user.email, user.name])
  if (newPassword === currentPassword) invalidInput([{ path: 'newPassword', message: 'choose a password different from the current one' }])
  try {
    await verifySigner(event, user.id, currentPassword, 'user', user.id)
  }
  catch (err) {
    if ((err as { statusCode?: number }).statusCode !== 403) throw err
    throw createError({ statusCode: 403, message: 'The current password is wrong: nothing was changed.', data: { fields: [{ path: 'currentPassword', message: 'wrong password' }] } })
  }
  const passwordHash = await inHashSlot(() => hashPassword(newPassword))
  const ended = await useDb().transaction(async (tx) => {
    await tx.update(schema.users).set({ passwordHash, updatedAt: new Date() }).where(eq(schema.users.id, user.id))
    const n = await endUserSessions(tx, user.id, 'password-change', event.context.sessionId)
    await audit(tx, event, { action: 'user.password-change', entity: 'user', entityId: user.id, newValues: { sessionsEnded: n } })
    return n
  })
  return { ok: true, sessionsEnded: ended }
})
