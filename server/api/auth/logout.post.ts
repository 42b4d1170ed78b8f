export default defineEventHandler(async (event) => {
  const user = await requireUser(event)
  await useDb().transaction(tx => audit(tx, event, { action: 'auth.logout', entity: 'user', entityId: user.id }))
  await clearUserSession(event)
  return { ok: true }
})
