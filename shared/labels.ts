// The words Emberline uses for states, on every page and in every e-mail.
import type { VesselState } from './domain/vessel-state'

export const VESSEL_STATE_LABELS: Record<VesselState, string> = {
  'in-service': 'In service',
  'service-due': 'Service due soon',
  'overdue': 'Service overdue',
  'requalification-due': 'Requalification due',
  'locked-out': 'Locked out',
  'away': 'Away for requalification',
  'awaiting-verification': 'Awaiting check run',
  'retired': 'Retired',
}

export const RUN_STATUS_LABELS: Record<string, string> = {
  'draft': 'Draft',
  'ready': 'Ready to fire',
  'awaiting-approval': 'Awaiting signature',
  'blocked': 'Blocked',
  'rejected': 'Rejected',
  'fired': 'Fired',
  'withdrawn': 'Withdrawn',
}

export const VESSEL_CLASS_LABELS: Record<string, string> = {
  'standard': 'Standard',
  'high-strength': 'High-strength',
}

/** What a vessel's state allows, in one wording for the pages and the e-mails; null when every run may be fired. */
export function vesselFiringWords(v: { blocksAllFirings: boolean, blocksSampleRuns: boolean }): string | null {
  if (v.blocksAllFirings) return 'No run may be fired in this vessel'
  if (v.blocksSampleRuns) return 'Only standardisation and check runs may be fired in this vessel'
  return null
}

/** Why a check run cannot be planned on a vessel without an accepted energy equivalent: one wording for the planner, the API and the Bench. */
export function noEnergyEquivalentWords(vesselName: string): string {
  return `standardise the vessel first: ${vesselName} has no accepted energy equivalent, so a check run on it could not be evaluated. Plan a series of benzoic-acid standardisation runs and have a supervisor accept it on the Standardisation page.`
}
