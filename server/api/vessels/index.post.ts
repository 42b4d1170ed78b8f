import { or, eq } from 'drizzle-orm'
import { vesselCreateSchema } from '#shared/schemas/vessels'

// Registering a vessel is the admin's; the rated limits come from the vessel's own documentation.
export default defineEventHandler(async (event) => {
  await requireRole(event)
  const input = await parseBody(event, vesselCreateSchema)
  const policy = await getPolicy()
  const row = await useDb().transaction(async (tx) => {
    const [clash] = await tx.select({ name: schema.vessels.name, serialNumber: schema.vessels.serialNumber }).from(schema.vessels)
      .where(or(eq(schema.vessels.name, input.name), eq(schema.vessels.serialNumber, input.serialNumber)))
    if (clash) {
      const field = clash.name === input.name ? 'name' : 'serialNumber'
      throw createError({ statusCode: 409, message: `A vessel with this ${field === 'name' ? 'name' : 'serial number'} is already registered.`, data: { fields: [{ path: field, message: 'already registered' }] } })
    }
    const proof = input.proofCharge ?? { massG: policy.proofChargeMassG, heatingValueJPerG: policy.proofChargeHeatingValueJPerG, fillPressureMPa: policy.proofChargeFillPressureMPa }
    const [created] = await tx.insert(schema.vessels).values({
      name: input.name,
      serialNumber: input.serialNumber,
      class: input.class,
      ratedEnergyJ: input.ratedEnergyJ,
      maxChargeMassG: input.maxChargeMassG,
      maxFillPressureMPa: input.maxFillPressureMPa,
      volumeMl: input.volumeMl,
      halogenResistant: input.halogenResistant,
      proofChargeMassG: proof.massG,
      proofChargeHeatingValueJPerG: proof.heatingValueJPerG,
      proofChargeFillPressureMPa: proof.fillPressureMPa,
      serviceIntervalFirings: input.serviceIntervalFirings ?? policy.serviceIntervalFirings,
      serviceIntervalDays: input.serviceIntervalDays ?? policy.serviceIntervalDays,
      requalificationIntervalFirings: input.requalificationIntervalFirings ?? policy.requalificationIntervalFirings,
      location: input.location,
      notes: input.notes,
      condition: input.initialCondition,
      conditionSince: input.initialCondition === 'normal' ? null : new Date(),
      conditionReason: input.initialCondition === 'normal' ? null : 'recorded at registration',
      firingsSinceService: input.initialFiringsSinceService,
      firingsSinceRequalification: input.initialFiringsSinceRequalification,
      firingsTotal: input.initialFiringsTotal,
      firingsTotalAtRegistration: input.initialFiringsTotal,
      lastServicedAt: input.lastServicedAt ? new Date(input.lastServicedAt) : null,
    }).returning()
    await audit(tx, event, { action: 'vessel.register', entity: 'vessel', entityId: created!.id, newValues: created })
    return created!
  })
  setResponseStatus(event, 201)
  return vesselView(row, policy)
})
