// Ends every session the user holds, on every device, at their next request.
export default defineEventHandler(async (event) => {
  await requireRole(event)
  const { id } = parseParams(event, uuidParam)
  await useDb().transaction(async (tx) => {
    await findUserOr404(tx, id)
    const sessionsEnded = await endUserSessions(tx, id, 'ended-by-admin')
    await audit(tx, event, { action: 'user.sessions-ended', entity: 'user', entityId: id, newValues: { sessionsEnded } })
  })
  return { ok: true }
})
