// The assessment of one charge: heat, oxygen, peak bound, screening and vessel state turned into findings and a verdict.
import { fillGaugeForOxygenMol } from '../oxygen'
import { proofChargeBound } from '../peak-pressure'
import type { LabPolicy } from '../policy'
import { type Assessment, type ChargeInput, ChargeInputError, type ComponentAssessment, type Finding, type Severity, type Suggestions, type Verdict } from './contract'
import { fillInWindow, finding, grams, kJ, mpa, over, pct, reduceSampleTo, sampleConditionFindings, screeningFindings, under, vesselFindings } from './findings'
import { ceil2, energyLimit, floor2, massLimit, oxygenLimit, peakLimit, suggestAidMass, suggestFromModel } from './limits'
import { buildModel, type ComponentModel, peakAt, stateAt, validate } from './model'
import { methodNotes } from './notes'

const VERDICT_OF: Record<Severity, Verdict> = { block: 'blocked', approval: 'needs-approval', info: 'clear' }

/**
 * Assesses one charge whose formulas and structures are already resolved: heat release, oxygen
 * demand and availability, the peak-pressure bound against the proof-charge bound, energetic screening and the
 * vessel's state, as findings from the policy; the verdict is the worst severity. Throws ChargeInputError.
 */
export function assessCharge(input: ChargeInput, policy: LabPolicy): Assessment {
  validate(input)
  const v = input.vessel
  const model = buildModel(input, policy)
  const proof = proofChargeBound(v, policy)
  const suggestion = suggestFromModel(model, input, policy, proof.pressureMPa)

  const findings: Finding[] = []
  // A missing sample mass is assessed at the suggested one, so planning shows the charge it would become.
  const m = model.sampleMassMissing ? (suggestion.targetSampleMassG ?? 0) : model.baseSampleMassG
  const massOf = (c: ComponentModel) => (c.role === 'sample' ? m * (model.shares.get(c.index) ?? 0) : c.massG)
  const s = stateAt(model, m)
  if (!(s.freeVolumeMl > 0)) {
    throw new ChargeInputError([{ path: ['components'], message: `the charge and ${model.geometry.waterMl} mL of water leave no gas volume in a ${v.volumeMl} mL vessel` }])
  }
  const peak = peakAt(model, m)
  const demand = s.demandMol
  const excess = demand > 0 ? s.oxygenMol / demand : null
  const geometry = { ...model.geometry, chargeVolumeMl: model.geometry.volumeMl - model.geometry.waterMl - s.freeVolumeMl }
  const fillFor = (ratio: number) => (demand > 0 ? ceil2(fillGaugeForOxygenMol(ratio * demand, geometry)) : null)

  findings.push(...vesselFindings(input, policy))
  findings.push(...screeningFindings(model, input, policy, s.chargeMassG, massOf))

  // Energy against the rating.
  if (over(s.heatJ, v.ratedEnergyJ)) {
    const limit = energyLimit(model, v.ratedEnergyJ)
    findings.push(finding('energy-over-rating', `Heat release ${kJ(s.heatJ)} exceeds the vessel rating of ${kJ(v.ratedEnergyJ)}: ${reduceSampleTo(model, limit)}.`, { heatReleaseJ: s.heatJ, ratedEnergyJ: v.ratedEnergyJ, maxSampleMassG: floor2(Math.max(0, limit)) }))
  }
  else if (over(s.heatJ, policy.approvalEnergyFraction * v.ratedEnergyJ)) {
    const threshold = policy.approvalEnergyFraction * v.ratedEnergyJ
    const limit = energyLimit(model, threshold)
    findings.push(finding('energy-near-rating', `Heat release ${kJ(s.heatJ)} is above ${pct(policy.approvalEnergyFraction * 100)} of the vessel rating (${kJ(threshold)} of ${kJ(v.ratedEnergyJ)}): a supervisor must approve, or ${reduceSampleTo(model, limit)}.`, { heatReleaseJ: s.heatJ, thresholdJ: threshold }))
  }

  // Charge mass (sample + aid, fuse excluded).
  if (over(s.chargeMassG, v.maxChargeMassG)) {
    findings.push(finding('mass-over-maximum', `Charge mass ${grams(s.chargeMassG)} (sample + aid) exceeds the vessel maximum of ${grams(v.maxChargeMassG)}: ${reduceSampleTo(model, massLimit(model, v.maxChargeMassG))}.`, { chargeMassG: s.chargeMassG, maxChargeMassG: v.maxChargeMassG }))
  }

  // Oxygen fill against the vessel and the method.
  if (over(input.fillPressureMPa, v.maxFillPressureMPa)) {
    findings.push(finding('fill-over-maximum', `Oxygen fill ${mpa(input.fillPressureMPa)} gauge exceeds the vessel maximum of ${mpa(v.maxFillPressureMPa)} gauge: fill to ≤ ${mpa(v.maxFillPressureMPa)} gauge.`, { fillPressureMPa: input.fillPressureMPa, maxFillPressureMPa: v.maxFillPressureMPa }))
  }
  if (under(input.fillPressureMPa, policy.fillPressureWindowMinMPa) || over(input.fillPressureMPa, policy.fillPressureWindowMaxMPa)) {
    findings.push(finding('fill-outside-window', `Oxygen fill ${mpa(input.fillPressureMPa)} gauge is outside the method window ${policy.fillPressureWindowMinMPa.toFixed(2)}–${mpa(policy.fillPressureWindowMaxMPa)} gauge: fill within the window, or a supervisor must approve.`, { fillPressureMPa: input.fillPressureMPa }))
  }

  // Oxygen excess.
  if (excess !== null && under(excess, policy.minOxygenExcess)) {
    const need = fillFor(policy.minOxygenExcess) ?? 0
    const limit = oxygenLimit(model, policy.minOxygenExcess)
    const raise = need <= v.maxFillPressureMPa
      ? `${fillInWindow(need, v.maxFillPressureMPa, policy)} or ${reduceSampleTo(model, limit)}`
      : `no fill up to the vessel maximum of ${mpa(v.maxFillPressureMPa)} gauge is enough (≥ ${mpa(need)} gauge needed): ${reduceSampleTo(model, limit)}`
    findings.push(finding('oxygen-insufficient', `Oxygen excess ${floor2(excess).toFixed(2)} is below ${policy.minOxygenExcess}: ${raise}.`, { oxygenExcess: excess, fillNeededMPa: need }))
  }
  else if (excess !== null && under(excess, policy.approvalOxygenExcess)) {
    const need = fillFor(policy.approvalOxygenExcess) ?? 0
    const limit = oxygenLimit(model, policy.approvalOxygenExcess)
    const raise = need <= Math.min(v.maxFillPressureMPa, policy.fillPressureWindowMaxMPa) ? `${fillInWindow(need, v.maxFillPressureMPa, policy)} or ${reduceSampleTo(model, limit)}` : reduceSampleTo(model, limit)
    findings.push(finding('oxygen-low', `Oxygen excess ${floor2(excess).toFixed(2)} is below ${policy.approvalOxygenExcess}: a supervisor must approve, or ${raise}.`, { oxygenExcess: excess, fillNeededMPa: need }))
  }

  // Peak bound against the proof charge's bound.
  if (over(peak.pressureMPa, proof.pressureMPa)) {
    const limit = peakLimit(model, proof.pressureMPa, m)
    findings.push(finding('peak-over-proof', `Peak-pressure bound ${mpa(peak.pressureMPa)} exceeds the bound of the vessel's proof charge (${mpa(proof.pressureMPa)}): ${reduceSampleTo(model, limit)}.`, { peakPressureBoundMPa: peak.pressureMPa, proofPeakPressureBoundMPa: proof.pressureMPa }))
  }

  findings.push(...sampleConditionFindings(model, input, policy, m, massOf))

  // Notes that need no action.
  if (model.sampleMassMissing && model.hasSample) {
    findings.push(finding('suggested-mass', suggestion.targetSampleMassG !== null
      ? `No sample mass given: assessed at the suggested ${grams(suggestion.targetSampleMassG)}, which releases about ${kJ(s.heatJ)} against a target of ${kJ(suggestion.targetEnergyJ)}.`
      : 'No sample mass given, and no sample mass passes with this aid, fuse and vessel.', { targetSampleMassG: suggestion.targetSampleMassG }))
  }
  const targetEnergyJ = suggestion.targetEnergyJ
  if (m > 0 && Math.abs(s.heatJ - targetEnergyJ) > policy.energyFarFromTargetFraction * targetEnergyJ) {
    const better = suggestion.targetSampleMassG !== null ? `; about ${grams(suggestion.targetSampleMassG)} of sample would come closer` : ''
    const offPct = ((s.heatJ - targetEnergyJ) / targetEnergyJ) * 100
    const what = input.standardEnergyJ !== undefined ? 'standardisation' : 'target'
    findings.push(finding('energy-far-from-standard', `Heat release ${kJ(s.heatJ)} is ${pct(Math.abs(offPct))} ${offPct < 0 ? 'below' : 'above'} the ${what} energy of ${kJ(targetEnergyJ)}${better}.`, { heatReleaseJ: s.heatJ, targetEnergyJ }))
  }
  const sampleAidHeatJ = model.fixed.sampleAidHeatJ + m * model.perSampleGram.heatJ
  const aidMassG = model.hasSample && m > 0 ? suggestAidMass(sampleAidHeatJ, policy) : null
  if (aidMassG !== null) {
    findings.push(finding('weak-sample-aid', `Sample and aid release only ${kJ(sampleAidHeatJ)} (below ${kJ(policy.weakSampleMinHeatReleaseJ)}): add about ${grams(aidMassG)} of benzoic acid as a combustion aid.`, { heatReleaseJ: sampleAidHeatJ, aidMassG }))
  }

  const worst = findings.some(f => f.severity === 'block') ? 'block' : findings.some(f => f.severity === 'approval') ? 'approval' : 'info'

  const components: ComponentAssessment[] = model.components.map((c) => {
    const mass = massOf(c)
    const out: ComponentAssessment = {
      heatingValueJPerG: c.heatingValueJPerG,
      heatingValueSource: c.source,
      heatReleaseJ: c.fixedHeatJ + mass * c.heatPerG,
      oxygenDemandMol: c.fixedDemandMol + mass * c.demandPerG,
    }
    if (c.screening?.oxygenBalancePct !== undefined) out.oxygenBalancePct = c.screening.oxygenBalancePct
    if (c.screening) out.screening = c.screening
    return out
  })

  const fillForExcess = fillFor(policy.approvalOxygenExcess)
  const suggestions: Suggestions = {
    maxSampleMassG: suggestion.maxSampleMassG,
    targetSampleMassG: suggestion.targetSampleMassG,
    fillPressureForExcessMPa: fillForExcess,
    ...(aidMassG !== null ? { aidMassG } : {}),
  }

  return {
    verdict: VERDICT_OF[worst],
    heatReleaseJ: s.heatJ,
    oxygenDemandMol: demand,
    oxygenAvailableMol: s.oxygenMol,
    oxygenExcess: excess,
    peakPressureBoundMPa: peak.pressureMPa,
    proofPeakPressureBoundMPa: proof.pressureMPa,
    components,
    findings,
    suggestions,
    notes: methodNotes(model, input, policy, { m, s, excess, peak, proof, massOf }),
  }
}
