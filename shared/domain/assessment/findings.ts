// Findings of a charge: the words that say what is wrong and how to fix it, with the number.
import type { LabPolicy } from '../policy'
import { EXPLOSOPHORE_GROUPS, oxidiserFractionPct } from '../screening'
import { type ChargeInput, FINDING_CODES, type Finding, type FindingCode, type VesselState } from './contract'
import { floor2 } from './limits'
import type { ChargeModel, ComponentModel } from './model'

export const kJ = (j: number) => `${(j / 1000).toFixed(1)} kJ`
export const grams = (g: number) => `${g.toFixed(2)} g`
export const mpa = (p: number) => `${p.toFixed(2)} MPa`
export const pct = (x: number) => `${Math.round(x)} %`
export const jPerG = (x: number) => `${Math.round(x).toLocaleString('en-US')} J/g`
// Comparisons allow for floating-point noise so a limit printed to 0.01 g passes when used.
export const over = (value: number, limit: number) => value > limit * (1 + 1e-9) + 1e-12
export const under = (value: number, limit: number) => value < limit * (1 - 1e-9) - 1e-12

export function finding(code: FindingCode, message: string, data?: Record<string, unknown>): Finding {
  return data ? { code, severity: FINDING_CODES[code].severity, message, data } : { code, severity: FINDING_CODES[code].severity, message }
}

export function reduceSampleTo(model: ChargeModel, limit: number): string {
  if (!model.hasSample) return 'reduce the combustion aid or the fuse'
  if (!(limit > 0.005)) return 'no sample mass passes with this aid and fuse: reduce the combustion aid'
  return `reduce the sample to ≤ ${grams(floor2(limit))}`
}

/** A fill advice inside the method window (never the arithmetic edge below it): the window's lower end, or the fill needed when higher. */
export function fillInWindow(need: number, vesselMaxMPa: number, policy: LabPolicy): string {
  const low = policy.fillPressureWindowMinMPa
  const high = Math.min(policy.fillPressureWindowMaxMPa, vesselMaxMPa)
  if (need > high) return `raise the fill to ≥ ${mpa(need)} gauge (above the method window ${low.toFixed(2)}–${mpa(policy.fillPressureWindowMaxMPa)} gauge: a supervisor must approve)`
  return `fill to ${mpa(Math.max(need, low))} gauge or more, within the method window ${low.toFixed(2)}–${mpa(high)} gauge,`
}

const STATE_BLOCKS: Partial<Record<VesselState, { code: FindingCode; what: string }>> = {
  'overdue': { code: 'vessel-overdue', what: 'is overdue for routine service: record the service (all seals renewed, leak test, electrode check) before firing' },
  'requalification-due': { code: 'vessel-requalification-due', what: 'is due for requalification: send it away and record the requalification before firing' },
  'locked-out': { code: 'vessel-locked-out', what: 'is locked out: it may be fired again only after requalification and a return-to-service record' },
  'away': { code: 'vessel-away', what: 'is away for requalification: record its return to service before firing' },
  'retired': { code: 'vessel-retired', what: 'is retired: choose another vessel' },
}

export function vesselFindings(input: ChargeInput, policy: LabPolicy): Finding[] {
  const v = input.vessel
  const name = v.name ? `Vessel ${v.name}` : 'The vessel'
  const state = v.state ?? 'in-service'
  const block = STATE_BLOCKS[state]
  if (block) return [finding(block.code, `${name} ${block.what}.`, { state })]
  if (state === 'awaiting-verification' && (input.runRole ?? 'sample') === 'sample') {
    return [finding('vessel-awaiting-verification', `${name} is awaiting verification after service: only a benzoic-acid check run may be fired until a check run passes.`, { state })]
  }
  if (state === 'service-due') {
    return [finding('service-due-soon', `${name} is due for service within ${policy.serviceDueMarginPct} % of its interval: plan a routine service.`, { state })]
  }
  return []
}

const APP6 = 'UN Manual of Tests and Criteria, Appendix 6'

/** Energetic screening, identity and oxidiser findings of every sample and aid (UN Manual of Tests and Criteria, Appendix 6). */
export function screeningFindings(model: ChargeModel, input: ChargeInput, policy: LabPolicy, chargeMassG: number, massOf: (c: ComponentModel) => number): Finding[] {
  const out: Finding[] = []
  const standard = input.vessel.class === 'standard'
  const inCharge = model.components.filter(c => c.inCharge)
  const oxidiserPct = oxidiserFractionPct(inCharge.map(c => ({ massG: massOf(c), oxidiser: c.screening?.oxidiser !== undefined })))
  // Organic matter anywhere in the charge, the cotton thread of the fuse included.
  const organicBeside = model.components.some(c => c.screening?.oxidiser === undefined && (c.screening?.organic ?? c.source === 'cotton'))
  const limit = policy.oxidiserFractionLimitPct
  const energetic: { index: number; label: string; why: string; groups: string[] }[] = []

  for (const c of inCharge) {
    const s = c.screening
    if (c.unresolved) {
      out.push(finding('composition-unresolved', `The formula or structure of ${c.label} has not been resolved yet: it cannot be screened; wait for the check to finish or have a supervisor approve.`, { component: c.index }))
    }
    if (!s) continue
    const groups = s.groups.map(g => EXPLOSOPHORE_GROUPS[g].label)
    if (s.status === 'energetic') energetic.push({ index: c.index, label: c.label, why: `${s.reasons.join('; ')}; rule: ${s.rule}`, groups })
    if (s.status === 'structure-needed') {
      out.push(finding('structure-needed', `Structure needed for ${c.label}: ${s.reasons.join('; ')}. Give the structure (SMILES) so the screen can look for the groups of ${APP6}, Table A6.1, or a supervisor must approve.`, { component: c.index, oxygenBalancePct: s.oxygenBalancePct, rule: s.rule }))
    }
    if (s.status === 'identity-unknown') {
      out.push(finding('identity-unknown', `Identity unknown for ${c.label}: ${s.reasons.join('; ')}. Choose its material from the library, give the structure (SMILES), or give an ultimate analysis with its material category (coal, coke, biomass, liquid fuel, waste fuel, food, feed, polymer); otherwise a supervisor must approve.`, { component: c.index, rule: s.rule }))
    }
    if (s.status === 'cleared' && (s.clearedBy === 'oxygen-balance' || s.clearedBy === 'decomposition-energy')) {
      out.push(finding('screen-cleared', `${c.label}: ${s.reasons.join('; ')}; the screen clears it (${s.rule}).`, { component: c.index, groups, rule: s.rule }))
    }
    if (s.oxidiser) {
      const text = `Oxidiser ${c.label} (${s.oxidiser.recognised}) is ${oxidiserPct.toFixed(1)} % of the charge mass (${grams(chargeMassG)})`
      if (oxidiserPct > limit && organicBeside) {
        out.push(finding('oxidiser-mixture', `${text}, above the ${limit} % limit with organic matter in the charge: the charge counts as energetic (${APP6}, oxidising mixtures).`, { component: c.index, oxidiserPct, limitPct: limit }))
        energetic.push({ index: c.index, label: c.label, why: `inorganic oxidiser ${oxidiserPct.toFixed(1)} % of a charge with organic matter, above ${limit} %`, groups: [] })
      }
      else if (oxidiserPct > limit) {
        out.push(finding('oxidiser-without-fuel', `${text} and nothing organic burns beside it: an oxidiser alone is not a calorimetric sample; mix it below ${limit} % into a fuel, or a supervisor must approve.`, { component: c.index, oxidiserPct, limitPct: limit }))
      }
      else {
        out.push(finding('oxidiser-mixture', `${text}, at or below the ${limit} % limit: the screen clears the mixture (${APP6}, oxidising mixtures).`, { component: c.index, oxidiserPct, limitPct: limit }))
      }
    }
  }

  for (const e of energetic) {
    if (standard) {
      out.push(finding('energetic-in-standard-vessel', `${e.label} screens as energetic (${e.why}): never in a standard vessel; use a high-strength vessel rated for energetic material.`, { component: e.index, groups: e.groups }))
    }
    else {
      out.push(finding('energetic-in-high-strength-vessel', `${e.label} screens as energetic (${e.why}): firing it in this high-strength vessel needs a supervisor's approval.`, { component: e.index, groups: e.groups }))
    }
  }
  return out
}

/** Metals, unknown heating values, volatile and chlorine-rich samples, and the smallest sample mass. */
export function sampleConditionFindings(model: ChargeModel, input: ChargeInput, policy: LabPolicy, sampleMassG: number, massOf: (c: ComponentModel) => number): Finding[] {
  const out: Finding[] = []
  const sealed = model.components.some(c => c.role === 'aid' && c.containment !== undefined)
  if (model.hasSample && !model.sampleMassMissing && under(sampleMassG, policy.minSampleMassG)) {
    out.push(finding('sample-below-minimum', `Sample mass ${(sampleMassG * 1000).toPrecision(3)} mg is below the lab's minimum of ${(policy.minSampleMassG * 1000).toFixed(0)} mg: weigh at least ${grams(policy.minSampleMassG)} of sample.`, { sampleMassG, minSampleMassG: policy.minSampleMassG }))
  }
  let chlorineG = 0
  for (const c of model.components) {
    if (!c.inCharge) continue
    if (c.elementFuel) {
      const f = c.elementFuel
      out.push(finding('metal-powder', `${c.label} is ${f.element}, which burns to ${f.oxide} at ${jPerG(f.heatingValueJPerG)} (NIST-JANAF formation enthalpy) and may burn violently as a powder: a supervisor must approve it in any vessel.`, { component: c.index, element: f.element, heatingValueJPerG: f.heatingValueJPerG }))
    }
    if (c.source === 'policy-fallback') {
      const why = c.fallbackReason ? ` (${c.fallbackReason})` : ''
      out.push(finding('heating-value-unknown', `No usable heating value for ${c.label}${why}: assessed with the conservative ${jPerG(policy.fallbackHeatingValueJPerG)}; give a measured value, or a supervisor must approve.`, { component: c.index }))
    }
    if (c.source === 'correlation' && c.estimate && c.estimate.violations.length > 0) {
      const outside = c.estimate.violations.map(x => `${x.field} ${x.value.toFixed(2)} % outside ${x.min}–${x.max} %`).join(', ')
      out.push(finding('composition-outside-correlation', `The composition of ${c.label} is outside the range of the Channiwala–Parikh correlation (${outside}, dry basis): give a measured heating value, or a supervisor must approve.`, { component: c.index, violations: c.estimate.violations }))
    }
    if (c.volatile && !sealed) {
      out.push(finding('volatile-unsealed', `${c.label} ${c.volatile}: it evaporates while the vessel is filled and can burn as a vapour; seal it in a capsule or under combustible tape (add that aid to the charge), or a supervisor must approve.`, { component: c.index }))
    }
    if (c.role === 'sample') chlorineG += c.chlorineFraction * massOf(c)
  }
  const chlorinePct = sampleMassG > 0 ? (chlorineG / sampleMassG) * 100 : 0
  if (chlorinePct > policy.halogenSharePct) {
    if (input.vessel.halogenResistant) {
      out.push(finding('halogen-acid', `The sample holds ${chlorinePct.toFixed(1)} % chlorine: burning it forms hydrochloric acid; rinse the vessel and check the seals for corrosion after firing.`, { chlorinePct }))
    }
    else {
      out.push(finding('halogen-vessel', `The sample holds ${chlorinePct.toFixed(1)} % chlorine, above the lab's ${policy.halogenSharePct} %: burning it forms hydrochloric acid, which corrodes a vessel not made for it; use a vessel marked halogen-resistant, reduce the chlorine share to ≤ ${policy.halogenSharePct} %, or a supervisor must approve.`, { chlorinePct, limitPct: policy.halogenSharePct }))
    }
  }
  return out
}
