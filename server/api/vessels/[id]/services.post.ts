import { serviceInputSchema } from '#shared/schemas/services'

// A servicing record (technician): signed by re-entering the password, audited, and applied to the
// vessel in the same transaction (counters, dates, condition). Files are uploaded first and named by id.
export default defineEventHandler(async (event) => {
  const user = await requireRole(event)
  const { id } = parseParams(event, vesselIdParam)
  const input = await parseBody(event, serviceInputSchema)
  // The checklist rules come before the password: a refused record needs no signature.
  checkServiceRules(input, await findVesselOr404(useDb(), id), new Date(), !!input.correctsId)
  const result = await signWithPassword(event, user, { entity: 'vessel', entityId: id, password: input.password }, signer => recordService(signer, id, input))
  setResponseStatus(event, 201)
  return result
})
