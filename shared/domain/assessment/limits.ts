// Sample-mass limits of a charge model and the suggested masses (heat and oxygen are linear in the sample mass).
import { proofChargeBound } from '../peak-pressure'
import type { LabPolicy } from '../policy'
import type { ChargeInput } from './contract'
import { buildModel, type ChargeModel, peakAt, stateAt, validate } from './model'

/** Largest sample mass with Q ≤ energy (Q linear in m: Q = Q_fixed + m·q). */
export function energyLimit(model: ChargeModel, energyJ: number): number {
  const q = model.perSampleGram.heatJ
  const room = energyJ - model.fixed.heatJ
  if (q <= 0) return room >= 0 ? Infinity : 0
  return room / q
}

export function massLimit(model: ChargeModel, maxChargeMassG: number): number {
  return maxChargeMassG - model.fixed.massG
}

/** Largest sample mass with available/demand ≥ ratio; both are linear in m (free volume shrinks by m/density). */
export function oxygenLimit(model: ChargeModel, ratio: number): number {
  const v0 = model.geometry.volumeMl - model.geometry.waterMl - model.fixed.volumeMl
  const numerator = model.o2PerMl * v0 - ratio * model.fixed.demandMol
  const denominator = model.o2PerMl * model.perSampleGram.volumeMl + ratio * model.perSampleGram.demandMol
  if (denominator <= 0) return numerator >= 0 ? Infinity : 0
  return numerator / denominator
}

/** Largest sample mass in [0, upper] whose peak bound stays at or below the proof bound (bisection). */
export function peakLimit(model: ChargeModel, proofMPa: number, upper: number): number {
  const ceiling = Number.isFinite(upper) ? upper : 1000
  const free = (m: number) => stateAt(model, m).freeVolumeMl > 0
  if (free(ceiling) && peakAt(model, ceiling).pressureMPa <= proofMPa) return ceiling
  if (peakAt(model, 0).pressureMPa > proofMPa) return 0
  let lo = 0
  let hi = ceiling
  for (let i = 0; i < 40 && hi - lo > 1e-6; i++) {
    const mid = (lo + hi) / 2
    if (free(mid) && peakAt(model, mid).pressureMPa <= proofMPa) lo = mid
    else hi = mid
  }
  return lo
}

export const floor2 = (x: number) => Math.floor(x * 100 + 1e-7) / 100
export const ceil2 = (x: number) => Math.ceil(x * 100 - 1e-7) / 100

export interface SampleMassSuggestion {
  maxSampleMassG: number | null
  targetSampleMassG: number | null
  targetEnergyJ: number
  limitedBy: 'target' | 'energy' | 'mass' | 'oxygen' | 'peak' | 'none'
}

export function suggestFromModel(model: ChargeModel, input: ChargeInput, policy: LabPolicy, proofMPa: number): SampleMassSuggestion {
  const targetEnergyJ = input.standardEnergyJ ?? policy.targetEnergyJ
  if (!model.hasSample) return { maxSampleMassG: null, targetSampleMassG: null, targetEnergyJ, limitedBy: 'none' }
  const v = input.vessel
  const hardCap = Math.min(energyLimit(model, v.ratedEnergyJ), massLimit(model, v.maxChargeMassG), oxygenLimit(model, policy.minOxygenExcess))
  const maxRaw = peakLimit(model, proofMPa, Math.max(0, hardCap))
  const caps: [SampleMassSuggestion['limitedBy'], number][] = [
    ['energy', energyLimit(model, policy.approvalEnergyFraction * v.ratedEnergyJ)],
    ['mass', massLimit(model, v.maxChargeMassG)],
    ['oxygen', oxygenLimit(model, policy.approvalOxygenExcess)],
  ]
  let limitedBy: SampleMassSuggestion['limitedBy'] = 'target'
  let target = model.perSampleGram.heatJ > 0 ? (targetEnergyJ - model.fixed.heatJ) / model.perSampleGram.heatJ : Infinity
  for (const [name, cap] of caps) {
    if (cap < target) {
      target = cap
      limitedBy = name
    }
  }
  if (target > maxRaw) {
    target = maxRaw
    limitedBy = 'peak'
  }
  const maxSampleMassG = Number.isFinite(maxRaw) ? Math.max(0, floor2(maxRaw)) : null
  const targetSampleMassG = Number.isFinite(target) && target > 0 ? floor2(target) : null
  return { maxSampleMassG, targetSampleMassG: targetSampleMassG === 0 ? null : targetSampleMassG, targetEnergyJ, limitedBy }
}

/**
 * Sample mass releasing the target energy (standardEnergyJ, else policy.targetEnergyJ) within the approval limits —
 * energy ≤ approvalEnergyFraction × rating, mass ≤ maximum, oxygen excess ≥ approvalOxygenExcess — and the hard
 * maximum; linear heat and oxygen balances, peak bound by bisection.
 */
export function suggestSampleMass(input: ChargeInput, policy: LabPolicy): SampleMassSuggestion {
  validate(input)
  const model = buildModel(input, policy)
  return suggestFromModel(model, input, policy, proofChargeBound(input.vessel, policy).pressureMPa)
}

/** Benzoic acid to add so that sample + aid release the weak-sample threshold, g = (threshold − Q)/q_BA (NIST SRM 39j q_BA); null when not weak. */
export function suggestAidMass(sampleAndAidHeatJ: number, policy: LabPolicy): number | null {
  if (sampleAndAidHeatJ >= policy.weakSampleMinHeatReleaseJ) return null
  return ceil2((policy.weakSampleMinHeatReleaseJ - sampleAndAidHeatJ) / policy.aidHeatingValueJPerG)
}
