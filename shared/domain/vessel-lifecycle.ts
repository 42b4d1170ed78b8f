// The vessel lifecycle: what a firing does to a vessel. Pure rules, applied by the server in the transaction
// that records the act and previewed by the pages.
//
// Service rules (common practice, vessel service guidance; no published standard): routine seal service every
// 500 firings or every 6 months, whichever comes first; requalification (hydrostatic/proof test, dimensional
// inspection) after 5,000 firings, after any overpressure event, or when damage or corrosion is seen; after any
// service only standardisation or check runs until a check run passes.

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
