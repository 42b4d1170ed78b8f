// The vessel lifecycle: what a firing does to a vessel. Pure rules, applied by the server in the transaction
// that records the act and previewed by the pages.
//
// Service rules (common practice, vessel service guidance; no published standard): routine seal service every
// 500 firings or every 6 months, whichever comes first; requalification (hydrostatic/proof test, dimensional
// inspection) after 5,000 firings, after any overpressure event, or when damage or corrosion is seen; after any
// service only standardisation or check runs until a check run passes.
import type { ServiceInput } from '../schemas/services'
import type { LabPolicy } from './policy'
import type { VesselCondition } from './vessel-state'

export const FIRING_OUTCOMES = ['complete', 'incomplete', 'misfire', 'leak', 'overpressure'] as const
export type FiringOutcome = typeof FIRING_OUTCOMES[number]

export const OUTCOME_LABELS: Record<FiringOutcome, string> = {
  complete: 'Complete combustion',
  incomplete: 'Incomplete combustion (soot or unburnt residue)',
  misfire: 'Misfire (no ignition)',
  leak: 'Leak',
  overpressure: 'Overpressure event',
}

/** Outcomes after which the vessel may not be fired again until requalified (common practice). */
export const LOCK_OUT_OUTCOMES: ReadonlySet<FiringOutcome> = new Set(['leak', 'overpressure'])

export interface FiringEffect {
  /** Every recorded firing adds one to each counter (since service, since requalification, lifetime). */
  counts: 1
  /** The vessel is locked out until requalified and returned to service. */
  lockOut: boolean
  /** The firing gives a result only after complete combustion. */
  givesResult: boolean
}

/** What a recorded firing does to its vessel, by outcome. */
export function firingEffect(outcome: FiringOutcome): FiringEffect {
  return { counts: 1, lockOut: LOCK_OUT_OUTCOMES.has(outcome), givesResult: outcome === 'complete' }
}

/** The lock-out reason written on the vessel after a leak or an overpressure event. */
export function lockOutReason(f: { outcome: FiringOutcome, sampleCode: string, seq: number, firedByName: string, at: Date, observations: string }): string {
  const when = f.at.toISOString().slice(0, 16).replace('T', ' ')
  return `${OUTCOME_LABELS[f.outcome]} on firing of ${f.sampleCode} (run #${f.seq}) recorded by ${f.firedByName} on ${when} UTC${f.observations ? `: ${f.observations}` : ''}. Requalify the vessel before any further firing.`
}

export interface CheckOutcome { passed: boolean, deviationPct: number, tolerancePct: number }

export interface CheckEffect {
  /** True when the vessel goes from awaiting verification back to normal service. */
  returnedToService: boolean
  /** The condition reason written on the vessel when it returns to service. */
  reason: string | null
  message: string
}

/**
 * A check run's result and its vessel (common practice): on a vessel awaiting verification after a service, a result
 * within the policy tolerance of the certified value returns it to service; a failure leaves it waiting (look for
 * the cause, fire another check run). On a vessel in any other condition the check changes nothing.
 */
export function checkRunEffect(vessel: { name: string, condition: string }, sampleCode: string, check: CheckOutcome): CheckEffect {
  const dev = check.deviationPct.toFixed(3)
  const tol = check.tolerancePct.toFixed(2)
  if (vessel.condition !== 'awaiting-verification') {
    return { returnedToService: false, reason: null, message: `Check run ${check.passed ? 'agrees' : 'does not agree'} with the certified value (deviation ${dev} %, tolerance ± ${tol} %).` }
  }
  if (!check.passed) {
    return { returnedToService: false, reason: null, message: `The check run deviates by ${dev} % from the certified value, outside ± ${tol} %: ${vessel.name} stays awaiting verification. Look for the cause (leak, incomplete combustion, weighing) and fire another check run.` }
  }
  const reason = `Check run ${sampleCode} agreed with the certified value within ${dev} % (tolerance ± ${tol} %).`
  return { returnedToService: true, reason, message: `${reason} ${vessel.name} is back in service.` }
}

/** A record or act that the vessel's condition does not allow (the server answers 409 with the sentence). */
export class LifecycleRefusal extends Error {
  constructor(message: string) {
    super(message)
    this.name = 'LifecycleRefusal'
  }
}

/** What the service rules read of a vessel. */
export interface VesselConditionLike { condition: string, conditionReason: string | null }

/** Why a vessel is locked out; only a failed bench check can be cleared by a passing routine service, the rest need a requalification. */
export type LockCause = 'service-check' | 'damage' | 'requalification-failed' | 'manual'

const fmt = (n: number, d = 0) => n.toLocaleString('en-GB', { minimumFractionDigits: d, maximumFractionDigits: d })
const isoDay = (d: Date) => d.toISOString().slice(0, 10)

/** What a record does to its vessel: counters reset, dates, condition and its reason. */
export interface ServiceEffect {
  reset: 'service' | 'both' | null
  condition: VesselCondition
  /** Set when this record (re)locks the vessel out. */
  lockCause: LockCause | null
  reason: string | null
  /** True when a routine service passed its leak test and electrode resistance check. */
  checksPassed?: boolean
  message: string
}

function conflict(message: string): never {
  throw new LifecycleRefusal(message)
}

/** Locks out, or keeps an existing lock-out; a failed bench check never replaces a lock-out that needs requalification. */
function lock(vessel: VesselConditionLike, cause: LockCause, reason: string, extra: Partial<ServiceEffect> = {}): ServiceEffect {
  if (vessel.condition === 'locked-out' && cause === 'service-check') {
    return { reset: null, condition: 'locked-out', lockCause: null, reason: vessel.conditionReason, ...extra, message: `Recorded. The vessel stays locked out: ${reason}` }
  }
  return { reset: null, condition: 'locked-out', lockCause: cause, reason, ...extra, message: `Recorded. The vessel is locked out: ${reason}` }
}

/** After any service: only standardisation and check runs until a check run passes (common practice). */
const AWAIT_CHECK = 'Awaiting a passing check run: only standardisation or check runs until then.'

/**
 * The effect of a new (not correcting) record on its vessel (common practice: all seals renewed together, a leak
 * test and an electrode check after every service); a LifecycleRefusal when the vessel's condition does not allow it.
 * Return to service needs `returnAllowed` (see returnToServiceCheck).
 */
export function serviceEffect(vessel: VesselConditionLike, input: ServiceInput, policy: LabPolicy, returnAllowed: { ok: boolean, why: string }): ServiceEffect {
  const c = vessel.condition as VesselCondition
  if (c === 'retired') conflict('The vessel is retired: no servicing records are added to it.')
  if (c === 'away' && input.kind !== 'requalification') {
    conflict('The vessel is away for requalification: record its requalification when it comes back.')
  }
  const keepLock = c === 'locked-out'
  switch (input.kind) {
    case 'routine': {
      const problems: string[] = []
      if (!input.leakTest.passed) problems.push(`the leak test under water failed (bubbles at ${input.leakTest.where}); never fire a vessel with a failed leak test.`)
      if (input.electrodeResistanceOhm > policy.electrodeResistanceMaxOhm) {
        problems.push(`the electrode resistance of ${fmt(input.electrodeResistanceOhm, 2)} Ω is above the limit of ${fmt(policy.electrodeResistanceMaxOhm, 2)} Ω.`)
      }
      const damaged = [['sealing surfaces', input.sealingSurfaces], ['threads', input.threads]].filter(([, v]) => v === 'damaged' || v === 'corroded')
      if (damaged.length) {
        const seen = damaged.map(([w, v]) => `${v} ${w}`).join(' and ')
        return lock(vessel, 'damage', `${seen} seen at the routine service; the vessel must be requalified.${problems.length ? ` Also: ${problems.join(' ')}` : ''}`, { checksPassed: false })
      }
      if (problems.length) return lock(vessel, 'service-check', `at the routine service ${problems.join(' Also, ')}`, { checksPassed: false })
      if (keepLock) {
        return { reset: 'service', condition: 'locked-out', lockCause: null, reason: vessel.conditionReason, checksPassed: true, message: 'Routine service recorded and the service counter reset. The vessel stays locked out until a return to service is signed.' }
      }
      return { reset: 'service', condition: 'awaiting-verification', lockCause: null, reason: `Routine seal service recorded for ${isoDay(new Date(input.performedAt))}.`, checksPassed: true, message: `Routine service recorded: the service counter is reset. ${AWAIT_CHECK}` }
    }
    case 'requalification': {
      if (!input.passed) return lock(vessel, 'requalification-failed', `the requalification by ${input.body} failed (certificate ${input.certificateNumber}).`)
      if (keepLock) {
        return { reset: 'both', condition: 'locked-out', lockCause: null, reason: vessel.conditionReason, message: 'Requalification recorded and both counters reset. The vessel stays locked out until a technician signs its return to service.' }
      }
      return { reset: 'both', condition: 'awaiting-verification', lockCause: null, reason: `Requalified by ${input.body} (certificate ${input.certificateNumber}) on ${isoDay(new Date(input.performedAt))}.`, message: `Requalification recorded: both counters are reset. ${AWAIT_CHECK}` }
    }
    case 'inspection':
      if (input.damageOrCorrosionSeen) return lock(vessel, 'damage', `damage or corrosion seen at inspection: ${input.findings}`)
      return { reset: null, condition: c, lockCause: null, reason: vessel.conditionReason, message: 'Inspection recorded. The vessel\'s condition is unchanged.' }
    case 'repair':
      if (keepLock) return { reset: null, condition: c, lockCause: null, reason: vessel.conditionReason, message: 'Repair recorded. The vessel stays locked out until a return to service is signed.' }
      return { reset: null, condition: 'awaiting-verification', lockCause: null, reason: `Repaired on ${isoDay(new Date(input.performedAt))}.`, message: `Repair recorded. ${AWAIT_CHECK}` }
    case 'lock-out':
      if (keepLock) conflict('The vessel is already locked out.')
      return lock(vessel, 'manual', input.reason)
    case 'return-to-service':
      if (!keepLock) conflict('Only a locked-out vessel is returned to service.')
      if (!returnAllowed.ok) conflict(returnAllowed.why)
      return { reset: null, condition: 'awaiting-verification', lockCause: null, reason: `Lock-out ended: ${input.reason}`, message: `Lock-out ended. ${AWAIT_CHECK}` }
    case 'sent-away':
      return { reset: null, condition: 'away', lockCause: null, reason: `Sent to ${input.destination} for ${input.purpose}.`, message: 'Recorded: the vessel is away and cannot be planned or fired until its requalification is recorded.' }
  }
}


/**
 * A correction fixes the record, not the past: it never resets counters or lifts a condition, but a
 * corrected record that shows a failed check, damage or a failed requalification still locks the vessel out.
 */
export function correctionEffect(vessel: VesselConditionLike, input: ServiceInput, policy: LabPolicy): ServiceEffect {
  const same = { reset: null, condition: vessel.condition as VesselCondition, lockCause: null, reason: vessel.conditionReason, message: 'Correction recorded. Counters and condition are unchanged by a correction.' }
  if (vessel.condition === 'retired') return same
  let danger: { cause: LockCause, reason: string } | null = null
  if (input.kind === 'routine') {
    const bad = [input.sealingSurfaces, input.threads].some(v => v === 'damaged' || v === 'corroded')
    if (bad) danger = { cause: 'damage', reason: 'damage or corrosion shown by a corrected routine service record; the vessel must be requalified.' }
    else if (!input.leakTest.passed || input.electrodeResistanceOhm > policy.electrodeResistanceMaxOhm) danger = { cause: 'service-check', reason: 'a corrected routine service record shows a failed leak test or electrode resistance above the limit.' }
  }
  if (input.kind === 'requalification' && !input.passed) danger = { cause: 'requalification-failed', reason: `the corrected requalification record shows a failed test (certificate ${input.certificateNumber}).` }
  if (input.kind === 'inspection' && input.damageOrCorrosionSeen) danger = { cause: 'damage', reason: `damage or corrosion in a corrected inspection record: ${input.findings}` }
  if (!danger) return same
  const e = lock(vessel, danger.cause, danger.reason)
  return { ...e, message: `Correction recorded. ${e.message.replace(/^Recorded\. /, '')}` }
}
