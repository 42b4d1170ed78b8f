import { and, desc, eq, gt, isNull } from 'drizzle-orm'

// The signed-in user's open sessions (this device marked), newest first.
export default defineEventHandler(async (event) => {
  const user = await requireUser(event)
  const policy = await getPolicy()
  const idleSince = new Date(Date.now() - policy.sessionIdleMinutes * 60_000)
  const createdSince = new Date(Date.now() - policy.sessionAbsoluteHours * 3_600_000)
  const rows = await useDb().select().from(schema.userSessions)
    .where(and(eq(schema.userSessions.userId, user.id), isNull(schema.userSessions.revokedAt), gt(schema.userSessions.lastSeenAt, idleSince), gt(schema.userSessions.createdAt, createdSince)))
    .orderBy(desc(schema.userSessions.lastSeenAt))
    .limit(100)
  return rows.map(s => ({ id: s.id, createdAt: s.createdAt, lastSeenAt: s.lastSeenAt, userAgent: s.userAgent, ip: s.ip, current: s.id === event.context.sessionId }))
})
