import { and, eq, ne, or } from 'drizzle-orm'
import { RATING_FIELDS, vesselPatchSchema } from '#shared/schemas/vessels'

// Ratings and intervals change only with a reason, audited with the values before and after.
export default defineEventHandler(async (event) => {
  await requireRole(event)
  const { id } = parseParams(event, vesselIdParam)
  const input = await parseBody(event, vesselPatchSchema)
  const policy = await getPolicy()
  const row = await useDb().transaction(async (tx) => {
    const before = await findVesselOr404(tx, id, true)
    const beforeView = vesselView(before, policy)
    const changedRatings = RATING_FIELDS.filter(f => input[f] !== undefined && JSON.stringify(input[f]) !== JSON.stringify(beforeView[f]))
    if (changedRatings.length && !input.reason) {
      invalidInput([{ path: 'reason', message: `say why the ${changedRatings.join(', ')} change (ratings are audited)` }])
    }
    if (input.name || input.serialNumber) {
      const [clash] = await tx.select({ id: schema.vessels.id }).from(schema.vessels).where(and(
        ne(schema.vessels.id, id),
        or(eq(schema.vessels.name, input.name ?? before.name), eq(schema.vessels.serialNumber, input.serialNumber ?? before.serialNumber)),
      ))
      if (clash) throw createError({ statusCode: 409, message: 'Another vessel already has this name or serial number.' })
    }
    const { proofCharge, reason, ...rest } = input
    const [updated] = await tx.update(schema.vessels).set({
      ...rest,
      ...(proofCharge ? { proofChargeMassG: proofCharge.massG, proofChargeHeatingValueJPerG: proofCharge.heatingValueJPerG, proofChargeFillPressureMPa: proofCharge.fillPressureMPa } : {}),
      updatedAt: new Date(),
    }).where(eq(schema.vessels.id, id)).returning()
    await audit(tx, event, {
      action: changedRatings.length ? 'vessel.ratings-change' : 'vessel.update',
      entity: 'vessel',
      entityId: id,
      oldValues: before,
      newValues: updated,
      reason: reason ?? null,
    })
    return updated!
  })
  return vesselView(row, policy)
})
