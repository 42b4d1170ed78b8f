// A vessel's servicing history for every role, newest first, with photos, certificates and corrections.
export default defineEventHandler(async (event) => {
  await requireUser(event)
  const { id } = parseParams(event, vesselIdParam)
  const db = useDb()
  await findVesselOr404(db, id)
  return await listServices(db, id)
})
