// "Sign out everywhere else": ends every session of the user but the one asking.
export default defineEventHandler(async (event) => {
  const user = await requireUser(event)
  const ended = await useDb().transaction(async (tx) => {
    const n = await endUserSessions(tx, user.id, 'ended-by-user', event.context.sessionId)
    await audit(tx, event, { action: 'user.sessions-ended', entity: 'user', entityId: user.id, newValues: { sessionsEnded: n, keptSessionId: event.context.sessionId } })
    return n
  })
  return { ok: true, ended }
})
