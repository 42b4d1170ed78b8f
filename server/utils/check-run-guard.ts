import { and, eq } from 'drizzle-orm'
import { noEnergyEquivalentWords } from '#shared/labels'

/** True when the vessel has an energy equivalent in force. */
export async function hasAcceptedEnergyEquivalent(db: Db | Tx, vesselId: string): Promise<boolean> {
  const [row] = await db.select({ id: schema.energyEquivalents.id }).from(schema.energyEquivalents)
    .where(and(eq(schema.energyEquivalents.vesselId, vesselId), eq(schema.energyEquivalents.active, true))).limit(1)
  return !!row
}

/**
 * A check run is compared with the vessel's accepted energy equivalent: refused up front (422 naming `kind`) when
 * there is none, before anything is planned, signed or fired.
 */
export async function refuseCheckRunWithoutEnergyEquivalent(db: Db | Tx, kind: string, vessel: { id: string, name: string }, path = 'kind') {
  if (kind !== 'check') return
  if (await hasAcceptedEnergyEquivalent(db, vessel.id)) return
  invalidInput([{ path, message: noEnergyEquivalentWords(vessel.name) }])
}
