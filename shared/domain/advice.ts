// One answer for a charge that is not clear: the sample mass, combustion aid and oxygen fill that clear every
// finding at once, re-assessed before it is offered. Each finding's own limit stays in the findings, as detail.
import { assessCharge, type Assessment, type ChargeInput, type Finding, type FindingCode, type ResolvedComponent, suggestAidMass, suggestSampleMass, type Verdict } from './assessment'
import type { LabPolicy } from './policy'

/** Findings a different sample mass, aid or fill can clear. */
const CHARGE_CODES: ReadonlySet<FindingCode> = new Set<FindingCode>([
  'energy-over-rating', 'energy-near-rating', 'mass-over-maximum', 'fill-over-maximum', 'fill-outside-window',
  'oxygen-insufficient', 'oxygen-low', 'peak-over-proof',
])
const VESSEL_PREFIX = 'vessel-'

export type AdviceKind =
  /** Nothing to change: the charge is clear. */
  | 'clear'
  /** Apply `changes` and the charge is clear (or only the `remaining` findings are left). */
  | 'change'
  /** The energetic screen stops the charge: no mass, aid or fill makes it safe, so none is offered. */
  | 'screen-stops'
  /** The vessel's state stops every charge: no change to the charge helps. */
  | 'vessel-stops'
  /** No sample mass passes with this aid, fuse and vessel. */
  | 'no-mass'

export interface AdviceChange {
  field: 'sampleMassG' | 'aidMassG' | 'fillPressureMPa'
  /** What the charge has now; null when not given. */
  from: number | null
  to: number
}

export interface ChargeAdvice {
  kind: AdviceKind
  changes: AdviceChange[]
  /** Total sample mass, g, after the advice (null without a sample). */
  sampleMassG: number | null
  /** Total combustion-aid mass, g, after the advice (null when the advice adds none). */
  aidMassG: number | null
  /** Oxygen fill, MPa gauge, after the advice. */
  fillPressureMPa: number
  /** Verdict of the charge with the advice applied, re-assessed by the same rules. */
  verdictAfter: Verdict
  /** Findings of block or approval severity that the advice cannot clear (e.g. an unknown heating value). */
  remaining: Finding[]
  /** The one sentence shown first. */
  summary: string
}

const SCREEN_CODES = new Set(['composition-unresolved', 'structure-needed', 'identity-unknown', 'metal-powder', 'oxidiser-without-fuel'])
const isScreenFinding = (f: Finding) => f.code.startsWith('energetic') || SCREEN_CODES.has(f.code)
  || (f.code === 'oxidiser-mixture' && f.data !== undefined && Number(f.data.oxidiserPct) > Number(f.data.limitPct))
const stopping = (a: Assessment) => a.findings.filter(f => f.severity !== 'info')
const g2 = (x: number) => `${x.toFixed(2)} g`
const mpa2 = (x: number) => `${x.toFixed(2)} MPa gauge`

/** The fill advised: the present one when it lies in the method window and under the vessel maximum, else the policy default, else the top of the window the vessel allows. */
export function windowFills(fillPressureMPa: number, vesselMaxMPa: number, policy: LabPolicy): number[] {
  const top = Math.min(policy.fillPressureWindowMaxMPa, vesselMaxMPa)
  const inWindow = (p: number) => p >= policy.fillPressureWindowMinMPa - 1e-9 && p <= top + 1e-9
  const out: number[] = []
  for (const p of [fillPressureMPa, policy.defaultFillPressureMPa, top]) if (inWindow(p) && !out.includes(p)) out.push(p)
  if (!out.length) out.push(Math.max(0, Math.min(policy.defaultFillPressureMPa, vesselMaxMPa)))
  return out
}

/** The components with the sample total scaled to `massG` (shares kept) and the aid set to `aidMassG`. */
function withAmounts(components: readonly ResolvedComponent[], massG: number | null, aid: { massG: number, heatingValueJPerG: number } | null): ResolvedComponent[] {
  const samples = components.filter(c => c.role === 'sample')
  const given = samples.reduce((s, c) => s + (c.massG ?? 0), 0)
  const out = components.map((c) => {
    if (c.role !== 'sample' || massG === null) return { ...c }
    const share = given > 0 ? (c.massG ?? 0) / given : 1 / samples.length
    return { ...c, massG: Math.round(massG * share * 1e4) / 1e4 }
  })
  if (aid) {
    const existing = out.findIndex(c => c.role === 'aid')
    if (existing >= 0) out[existing] = { ...out[existing]!, massG: aid.massG }
    else out.push({ role: 'aid', name: 'benzoic acid', massG: aid.massG, heatingValueJPerG: aid.heatingValueJPerG })
  }
  return out
}

/**
 * The sample mass that clears every charge limit at once: the suggestion of the assessment with the target energy
 * lifted out of the way, so that only the limits decide — heat ≤ approval fraction × rating, charge mass ≤ vessel
 * maximum, oxygen excess ≥ the approval level at this fill, peak bound ≤ proof-charge bound (all lab policy).
 */
function clearingMass(input: ChargeInput, policy: LabPolicy): number | null {
  const s = suggestSampleMass({ ...input, standardEnergyJ: 1e9 }, policy)
  return s.targetSampleMassG
}

function candidate(input: ChargeInput, policy: LabPolicy, fill: number): { input: ChargeInput, assessment: Assessment, massG: number | null, aidMassG: number | null } | null {
  const samples = input.components.filter(c => c.role === 'sample')
  const userMass = samples.every(c => c.massG === undefined) ? null : samples.reduce((s, c) => s + (c.massG ?? 0), 0)
  const currentAid = input.components.filter(c => c.role === 'aid').reduce((s, c) => s + (c.massG ?? 0), 0)
  let aidMassG: number | null = null
  const aidOf = () => (aidMassG === null ? null : { massG: aidMassG, heatingValueJPerG: policy.aidHeatingValueJPerG })
  let mass: number | null = null
  // Two rounds: an aid for a weak sample takes heat room, so the clearing mass is found again with it in the charge.
  for (let round = 0; round < 3; round++) {
    const base: ChargeInput = { ...input, fillPressureMPa: fill, components: withAmounts(input.components, null, aidOf()) }
    if (!samples.length) { mass = null; break }
    const cap = clearingMass(base, policy)
    if (cap === null) return null
    // A mass that passes is kept; one that must change goes to the target energy's mass, within every limit.
    const target = suggestSampleMass(base, policy).targetSampleMassG
    mass = userMass !== null && userMass <= cap + 1e-9 ? userMass : Math.min(target ?? cap, cap)
    const trial = assessCharge({ ...base, components: withAmounts(input.components, mass, aidOf()) }, policy)
    const weak = trial.findings.find(f => f.code === 'weak-sample-aid')
    if (!weak) break
    const more = suggestAidMass(Number(weak.data?.heatReleaseJ ?? 0), policy)
    if (more === null) break
    aidMassG = Math.round(((aidMassG ?? currentAid) + more) * 100) / 100
  }
  // Rounding to 0.01 g can land a hair above a limit: step down until the charge limits are all met.
  for (let step = 0; step < 5; step++) {
    const components = withAmounts(input.components, mass, aidOf())
    const out: ChargeInput = { ...input, fillPressureMPa: fill, components }
    const assessment = assessCharge(out, policy)
    if (!assessment.findings.some(f => CHARGE_CODES.has(f.code))) return { input: out, assessment, massG: mass, aidMassG }
    if (mass === null || mass <= 0.01) return null
    mass = Math.round((mass - 0.01) * 100) / 100
  }
  return null
}

/**
 * One answer for a charge whose formulas and structures are already resolved: the sample mass (kept when it already
 * passes), the benzoic-acid aid (NIST SRM 39j value from the policy) and an oxygen fill inside the method window that
 * together clear every finding a change of charge can clear. The answer is re-assessed before it is returned; no
 * amount is offered when the energetic screen or the vessel's state stops the charge.
 */
export function adviseCharge(input: ChargeInput, policy: LabPolicy, assessment: Assessment = assessCharge(input, policy)): ChargeAdvice {
  const samples = input.components.filter(c => c.role === 'sample')
  const currentMass = samples.length && samples.some(c => c.massG !== undefined) ? samples.reduce((s, c) => s + (c.massG ?? 0), 0) : null
  const currentAid = input.components.some(c => c.role === 'aid') ? input.components.filter(c => c.role === 'aid').reduce((s, c) => s + (c.massG ?? 0), 0) : null
  const none = (kind: AdviceKind, summary: string, remaining: Finding[]): ChargeAdvice => ({
    kind, changes: [], sampleMassG: currentMass, aidMassG: null, fillPressureMPa: input.fillPressureMPa, verdictAfter: assessment.verdict, remaining, summary,
  })
  if (assessment.verdict === 'clear') return none('clear', 'The charge is clear: nothing to change.', [])

  const screen = assessment.findings.filter(f => isScreenFinding(f) && f.severity !== 'info')
  if (screen.length) {
    return none('screen-stops', 'The energetic screen stops this charge: no sample mass, aid or fill makes it safe. Follow the screening finding (give the structure or a measured decomposition energy, use a vessel rated for energetic material, or have a supervisor decide).', screen)
  }
  const vessel = assessment.findings.filter(f => f.code.startsWith(VESSEL_PREFIX) && f.severity === 'block')
  if (vessel.length) return none('vessel-stops', 'The vessel cannot take this charge in its present state: no change to the charge helps.', vessel)

  // The present fill is kept when it lies in the method window; otherwise the policy default, then the window's top.
  let best: ReturnType<typeof candidate> = null
  for (const fill of windowFills(input.fillPressureMPa, input.vessel.maxFillPressureMPa, policy)) {
    best = candidate(input, policy, fill)
    if (best) break
  }
  if (!best) return none('no-mass', 'No sample mass passes with this aid, fuse and vessel: reduce the combustion aid or choose a larger vessel.', stopping(assessment))

  const changes: AdviceChange[] = []
  if (best.massG !== null && (currentMass === null || Math.abs(best.massG - currentMass) > 5e-5)) changes.push({ field: 'sampleMassG', from: currentMass, to: best.massG })
  if (best.aidMassG !== null && (currentAid === null || Math.abs(best.aidMassG - currentAid) > 5e-5)) changes.push({ field: 'aidMassG', from: currentAid, to: best.aidMassG })
  const fill = best.input.fillPressureMPa
  if (Math.abs(fill - input.fillPressureMPa) > 1e-9) changes.push({ field: 'fillPressureMPa', from: input.fillPressureMPa, to: fill })
  const remaining = stopping(best.assessment)
  const parts = changes.map(c => c.field === 'sampleMassG' ? `use ${g2(c.to)} of sample` : c.field === 'aidMassG' ? `${c.from ? 'use' : 'add'} ${g2(c.to)} of benzoic acid as combustion aid` : `fill to ${mpa2(c.to)}`)
  const what = parts.length ? parts.join(', ') : 'keep the charge as it is'
  const then = remaining.length ? `; still needed: ${remaining.map(f => f.message.split(':')[0]).join('; ')}` : ': the charge is then clear'
  return {
    kind: 'change',
    changes,
    sampleMassG: best.massG,
    aidMassG: best.aidMassG,
    fillPressureMPa: fill,
    verdictAfter: best.assessment.verdict,
    remaining,
    summary: `${what.charAt(0).toUpperCase()}${what.slice(1)}${then}.`,
  }
}

/** Notes that propose an amount (a mass, an aid): left out when the screen or the vessel stops the charge. */
const AMOUNT_NOTES: ReadonlySet<FindingCode> = new Set<FindingCode>(['weak-sample-aid', 'energy-far-from-standard', 'suggested-mass'])

/** The findings to show beside the advice: no amount is proposed for a charge that no amount can make safe. */
export function findingsBesideAdvice(findings: readonly Finding[], advice: ChargeAdvice | null): Finding[] {
  const stopped = advice?.kind === 'screen-stops' || advice?.kind === 'vessel-stops'
  return stopped ? findings.filter(f => !AMOUNT_NOTES.has(f.code)) : [...findings]
}
