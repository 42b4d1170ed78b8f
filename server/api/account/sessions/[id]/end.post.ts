import { and, eq } from 'drizzle-orm'
import { z } from 'zod'

const params = z.object({ id: z.string().uuid('a session id (UUID)') })

// Ends one of the user's own sessions (another device, or this one).
export default defineEventHandler(async (event) => {
  const user = await requireUser(event)
  const { id } = parseParams(event, params)
  const current = id === event.context.sessionId
  await useDb().transaction(async (tx) => {
    const [row] = await tx.select({ id: schema.userSessions.id }).from(schema.userSessions)
      .where(and(eq(schema.userSessions.id, id), eq(schema.userSessions.userId, user.id))).for('update')
    if (!row) throw createError({ statusCode: 404, message: 'No such session of yours.' })
    const ended = await endSession(tx, id, current ? 'sign-out' : 'ended-by-user')
    if (ended.length) await audit(tx, event, { action: 'user.session-end', entity: 'user', entityId: user.id, newValues: { sessionId: id, current } })
  })
  if (current) await clearUserSession(event)
  return { ok: true, signedOut: current }
})
