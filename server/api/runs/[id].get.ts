export default defineEventHandler(async (event) => {
  await requireRole(event)
  const { id } = parseParams(event, idParam)
  const db = useDb()
  const run = await findRunOr404(db, id)
  const sigs = await signaturesFor(db, [id])
  return runView(run, sigs.get(id))
})
