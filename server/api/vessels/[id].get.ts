export default defineEventHandler(async (event) => {
  await requireUser(event)
  const { id } = parseParams(event, vesselIdParam)
  const [row, policy] = await Promise.all([findVesselOr404(useDb(), id), getPolicy()])
  return vesselView(row, policy)
})
