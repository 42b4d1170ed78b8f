// One vessel with its state and counters, and the firings its accepted day plans book ahead (with the service date at that pace).
export default defineEventHandler(async (event) => {
  await requireUser(event)
  const { id } = parseParams(event, vesselIdParam)
  const db = useDb()
  const [row, policy] = await Promise.all([findVesselOr404(db, id), getPolicy()])
  const view = vesselView(row, policy)
  return { ...view, dayPlanForecast: await vesselDayPlanForecast(db, view) }
})
