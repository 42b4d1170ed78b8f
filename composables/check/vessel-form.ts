import type { VesselInput } from '#shared/domain/assessment'
import type { ProofCharge } from '#shared/domain/peak-pressure'
import type { VesselState } from '#shared/domain/vessel-state'

import { asNumber } from '~/composables/check/charge-form'

/** The fields of GET /api/vessels that the check needs. */
export interface VesselOption {
  id: string
  name: string
  serialNumber: string
  class: 'standard' | 'high-strength'
  ratedEnergyJ: number
  maxChargeMassG: number
  maxFillPressureMPa: number
  volumeMl: number
  proofCharge: ProofCharge
  state: VesselState
  stateReasons: string[]
  blocksSampleRuns: boolean
  blocksAllFirings: boolean
  location: string | null
}

export interface InlineVesselForm {
  ratedEnergyKJ: number | null
  maxChargeMassG: number | null
  maxFillPressureMPa: number | null
  volumeMl: number | null
  class: 'standard' | 'high-strength'
}

export const INLINE = 'inline'

/** The vessel as the assessment takes it (same fields the server takes from the record), or the fields still empty. */
export function vesselInput(choice: string, vessels: readonly VesselOption[], inline: InlineVesselForm): { vessel?: VesselInput, missing: string[] } {
  if (choice !== INLINE) {
    const v = vessels.find(x => x.id === choice)
    if (!v) return { missing: ['vessel'] }
    return {
      vessel: { name: v.name, class: v.class, ratedEnergyJ: v.ratedEnergyJ, maxChargeMassG: v.maxChargeMassG, maxFillPressureMPa: v.maxFillPressureMPa, volumeMl: v.volumeMl, proofCharge: v.proofCharge, state: v.state },
      missing: [],
    }
  }
  const kj = asNumber(inline.ratedEnergyKJ)
  const mass = asNumber(inline.maxChargeMassG)
  const fill = asNumber(inline.maxFillPressureMPa)
  const volume = asNumber(inline.volumeMl)
  const missing = [kj === undefined && 'rated energy', mass === undefined && 'maximum charge mass', fill === undefined && 'maximum fill', volume === undefined && 'volume'].filter((x): x is string => !!x)
  if (missing.length) return { missing }
  return { vessel: { class: inline.class, ratedEnergyJ: kj! * 1000, maxChargeMassG: mass!, maxFillPressureMPa: fill!, volumeMl: volume! }, missing: [] }
}
