// The vessel's accepted energy equivalent in force and every earlier acceptance, newest first.
export default defineEventHandler(async (event) => {
  await requireUser(event)
  const { id } = parseParams(event, vesselIdParam)
  const db = useDb()
  await findVesselOr404(db, id)
  const history = await energyEquivalentHistory(db, id)
  return { active: history.find(h => h.active) ?? null, history }
})
