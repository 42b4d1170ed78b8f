import { eq } from 'drizzle-orm'
import { z } from 'zod'
import { computeVesselState } from '#shared/domain/vessel-state'
import type { VesselCondition } from '#shared/domain/vessel-state'
import type { LabPolicy } from '#shared/domain/policy'
import type { vessels } from '../database/schema'

export type VesselRow = typeof vessels.$inferSelect

/** A vessel as the API shows it: its record, and the state the one state function computes from it. */
export function vesselView(v: VesselRow, policy: LabPolicy, now = new Date()) {
  const s = computeVesselState({
    firingsSinceService: v.firingsSinceService,
    firingsSinceRequalification: v.firingsSinceRequalification,
    firingsTotal: v.firingsTotal,
    lastServicedAt: v.lastServicedAt,
    registeredAt: v.registeredAt,
    serviceIntervalFirings: v.serviceIntervalFirings,
    serviceIntervalDays: v.serviceIntervalDays,
    requalificationIntervalFirings: v.requalificationIntervalFirings,
    condition: v.condition as VesselCondition,
    now,
    dueMarginPct: policy.serviceDueMarginPct,
  })
  return {
    id: v.id,
    name: v.name,
    serialNumber: v.serialNumber,
    class: v.class as 'standard' | 'high-strength',
    ratedEnergyJ: v.ratedEnergyJ,
    maxChargeMassG: v.maxChargeMassG,
    maxFillPressureMPa: v.maxFillPressureMPa,
    volumeMl: v.volumeMl,
    halogenResistant: v.halogenResistant,
    proofCharge: { massG: v.proofChargeMassG, heatingValueJPerG: v.proofChargeHeatingValueJPerG, fillPressureMPa: v.proofChargeFillPressureMPa },
    serviceIntervalFirings: v.serviceIntervalFirings,
    serviceIntervalDays: v.serviceIntervalDays,
    requalificationIntervalFirings: v.requalificationIntervalFirings,
    location: v.location,
    notes: v.notes,
    condition: v.condition,
    conditionReason: v.conditionReason,
    conditionSince: v.conditionSince,
    state: s.state,
    stateReasons: s.reasons,
    blocksSampleRuns: s.blocksSampleRuns,
    blocksAllFirings: s.blocksAllFirings,
    firingsSinceService: v.firingsSinceService,
    firingsSinceRequalification: v.firingsSinceRequalification,
    firingsTotal: v.firingsTotal,
    firingsUntilService: s.firingsUntilService,
    firingsUntilRequalification: s.firingsUntilRequalification,
    daysUntilService: s.daysUntilService,
    lastServicedAt: v.lastServicedAt,
    lastRequalifiedAt: v.lastRequalifiedAt,
    serviceDueAt: s.serviceDueAt,
    registeredAt: v.registeredAt,
    updatedAt: v.updatedAt,
  }
}
export type VesselView = ReturnType<typeof vesselView>

export const vesselIdParam = z.object({ id: z.string().uuid('a vessel id (UUID)') })

export async function findVesselOr404(db: Db | Tx, id: string, lock = false): Promise<VesselRow> {
  const q = db.select().from(schema.vessels).where(eq(schema.vessels.id, id))
  const [row] = lock ? await q.for('update') : await q
  if (!row) throw createError({ statusCode: 404, message: 'No such vessel.' })
  return row
}

/** The vessel as the charge assessment needs it (ratings, proof charge and current state). */
export function assessmentVessel(view: VesselView) {
  return {
    name: view.name,
    class: view.class,
    ratedEnergyJ: view.ratedEnergyJ,
    maxChargeMassG: view.maxChargeMassG,
    maxFillPressureMPa: view.maxFillPressureMPa,
    volumeMl: view.volumeMl,
    proofCharge: view.proofCharge,
    halogenResistant: view.halogenResistant,
    state: view.state,
  }
}
