// Sign-out ends the server-side session row: a copy of the cookie stops working too.
export default defineEventHandler(async (event) => {
  const user = await requireUser(event)
  const sessionId = event.context.sessionId
  await useDb().transaction(async (tx) => {
    if (sessionId) await endSession(tx, sessionId, 'sign-out')
    await audit(tx, event, { action: 'auth.logout', entity: 'user', entityId: user.id, newValues: { sessionId } })
  })
  await clearUserSession(event)
  return { ok: true }
})
