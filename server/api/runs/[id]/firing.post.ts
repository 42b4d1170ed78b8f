// Record a firing of a ready run (analyst): Idempotency-Key header required; the act is in server/utils/firing-record.ts.
export default defineEventHandler(async (event) => {
  const user = await requireRole(event)
  const { id } = parseParams(event, idParam)
  const key = idempotencyKey(event)
  const body = await parseBody(event, firingBodySchema)
  const { replayed, answer } = await answering(() => recordFiring(actOf(event, user), id, key, body, firingRequestHash(id, body)))
  if (replayed) setResponseHeader(event, 'Idempotent-Replayed', 'true')
  setResponseStatus(event, 201)
  return answer
})
