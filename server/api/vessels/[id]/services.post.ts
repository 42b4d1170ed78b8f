// A servicing record (technician): signed by re-entering the password, audited, and applied to the
// vessel in the same transaction (counters, dates, condition). Files are uploaded first and named by id.
export default defineEventHandler(async (event) => {
  const user = await requireRole(event, 'technician')
  const { id } = parseParams(event, vesselIdParam)
  const input = await parseBody(event, serviceInputSchema)
  // The checklist rules come before the password: a refused record needs no signature.
  checkServiceRules(input, await findVesselOr404(useDb(), id), new Date(), !!input.correctsId)
  await verifySigner(event, user.id, input.password, 'vessel', id)
  const result = await recordService(event, user, id, input)
  // A fresh session after a signature, as for approvals.
  await renewSession(event)
  setResponseStatus(event, 201)
  return result
})
