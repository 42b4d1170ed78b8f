// When a received sample's bench work is done: the rule the server applies at every firing, withdrawal, rejection and
// repeat of one of its runs, and the sample page explains.
import { firingEffect } from './vessel-lifecycle'
import type { FiringOutcome } from './vessel-lifecycle'

/** Runs that no longer count towards the sample: withdrawn (never to be fired) or rejected by a supervisor. */
const NOT_COUNTED = new Set(['withdrawn', 'rejected'])

export interface SampleBenchState { status: 'planned' | 'tested', why: string }

/**
 * A sample is `tested` when none of its runs still waits to be fired and its firings that give a result (complete
 * combustion) number at least the determinations asked for — those the analyst planned for the sample (the lab's
 * determinations per sample by default: duplicates, ISO 1928 reports the mean of duplicate determinations, from
 * memory), or as many as its runs when fewer are left (one withdrawn). A repeat of a failed firing is a run, not a
 * further determination.
 * A misfire or an incomplete firing gives no determination: the sample stays `planned` until a repeat is fired.
 * Withdrawn and rejected runs do not count.
 */
export function sampleBenchState(runStatuses: string[], firingOutcomes: string[], determinationsPlanned: number): SampleBenchState {
  const counted = runStatuses.filter(s => !NOT_COUNTED.has(s))
  const waiting = counted.filter(s => s !== 'fired').length
  const results = firingOutcomes.filter(o => firingEffect(o as FiringOutcome).givesResult).length
  const failed = firingOutcomes.length - results
  const needed = Math.max(1, Math.min(determinationsPlanned, counted.length))
  if (waiting) return { status: 'planned', why: `${waiting} run${waiting === 1 ? '' : 's'} of the sample still to be fired` }
  if (results < needed) {
    return { status: 'planned', why: `${results} of ${needed} determination${needed === 1 ? '' : 's'} gave a result: fire a repeat (duplicate the run) for the ${failed} firing${failed === 1 ? '' : 's'} without one` }
  }
  return { status: 'tested', why: `every run fired; ${results} determination${results === 1 ? '' : 's'} with a result` }
}
