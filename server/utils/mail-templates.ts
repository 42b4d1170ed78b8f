// Every e-mail Emberline sends, in one place: each function gives the subject and the plain text of one message.
// Routes and workers decide who gets it and when (enqueueMail); the words live here.
import { RUN_STATUS_LABELS, VESSEL_STATE_LABELS, vesselFiringWords } from '#shared/labels'
import type { VesselState } from '#shared/domain/vessel-state'
import type { FiringOutcome } from '#shared/domain/vessel-lifecycle'
import type { SignatureMeaning } from '#shared/states'
import { siteLink } from './site-url'
import type { VesselRow, vesselView } from './vessels'

export interface MailText { subject: string, text: string }

const SAFETY = 'Local regulations, the vessel maker\'s instructions and the lab\'s own procedures come first.'
const n = (x: number) => x.toLocaleString('en-GB')

/** To supervisors: a submitted plan has runs that need a signature (one message per plan, not per run). */
export function planSubmittedMail(p: { by: string, planName: string, waiting: { seq: number, sampleCode: string }[], counts: Record<string, number> }): MailText {
  return {
    subject: `Signature needed: ${p.waiting.length} run${p.waiting.length > 1 ? 's' : ''} in plan "${p.planName}"`,
    text: [
      `${p.by} submitted the plan "${p.planName}". These runs need a supervisor's signature before they may be fired:`,
      '',
      ...p.waiting.map(r => `  #${r.seq}  ${r.sampleCode}`),
      '',
      `Summary: ${Object.entries(p.counts).map(([s, k]) => `${k} ${RUN_STATUS_LABELS[s]?.toLowerCase() ?? s}`).join(', ')}.`,
      `Open Approvals in Emberline to review the findings and sign or reject: ${siteLink('/approvals')}`,
    ].join('\n'),
  }
}

/** To supervisors: the charge weighed at the firing is no longer covered by the signature given. */
export function signatureNeededAgainMail(p: { by: string, planName: string, seq: number, sampleCode: string, why: string[] }): MailText {
  return {
    subject: `Signature needed again: run ${p.sampleCode} in plan "${p.planName}"`,
    text: [
      `${p.by} weighed the charge of run #${p.seq} (${p.sampleCode}) for firing. The signature given no longer covers it:`,
      '',
      ...p.why.map(w => `  • ${w}`),
      '',
      `The run is back in Approvals (${siteLink('/approvals')}). It may be fired only after you sign the exception again.`,
    ].join('\n'),
  }
}

/** To supervisors and technicians: a leak or overpressure locked a vessel out. */
export function lockOutMail(p: { by: string, outcome: FiringOutcome, sampleCode: string, seq: number, vesselId: string, vesselName: string, serialNumber: string, observations: string }): MailText {
  return {
    subject: `Vessel ${p.vesselName} locked out: ${p.outcome} on firing of ${p.sampleCode}`,
    text: [
      `${p.by} recorded a ${p.outcome === 'leak' ? 'leak' : 'an overpressure event'} on the firing of ${p.sampleCode} (run #${p.seq}) in vessel ${p.vesselName} (serial ${p.serialNumber}).`,
      p.observations ? `Observations: ${p.observations}` : 'No observations were written.',
      '',
      `Emberline has locked the vessel out: no run can be fired in it until it has been requalified and returned to service.`,
      'Depressurise and open the vessel only as your procedures describe; keep it out of use and tagged.',
      `The vessel in Emberline: ${siteLink(`/vessels/${p.vesselId}`)}`,
      SAFETY,
    ].join('\n'),
  }
}

/** To the planner: a supervisor approved or rejected a run. */
export function runDecisionMail(p: { by: string, approved: boolean, meaning: SignatureMeaning, seq: number, sampleCode: string, planId: string, planName: string, reason: string }): MailText {
  return {
    subject: `Run ${p.sampleCode} ${p.approved ? 'approved — ready to fire' : 'rejected'}`,
    text: [
      `${p.by} ${p.meaning} run #${p.seq} (${p.sampleCode}) in plan "${p.planName}".`,
      `Reason: ${p.reason}`,
      '',
      p.approved ? 'The run is ready to fire.' : 'Change the charge and submit again, or withdraw the run.',
      `The plan in Emberline: ${siteLink(`/plans/${p.planId}`)}`,
    ].join('\n'),
  }
}

const WHAT_TO_DO: Partial<Record<VesselState, string>> = {
  'service-due': 'Plan the routine seal service: every seal renewed together, the valve seat renewed, then a leak test under water and the electrode resistance check.',
  'overdue': 'Record the routine seal service in Emberline (every seal renewed, leak test, electrode check); until then no run may be fired in the vessel.',
  'requalification-due': 'Send the vessel for requalification (hydrostatic or proof test and dimensional inspection) before any further firing.',
  'locked-out': 'Do not fill or fire the vessel. It returns to service only with a signed return-to-service record after a passing requalification (or, for a failed leak test or electrode check, a routine service that passes both).',
}

/** To technicians and supervisors: a vessel entered a state that needs someone's hands (sent once per change). */
export function vesselReminderMail(v: VesselRow, view: ReturnType<typeof vesselView>): MailText {
  const firing = vesselFiringWords(view)
  return {
    subject: `${v.name}: ${VESSEL_STATE_LABELS[view.state]}`,
    text: [
      `${v.name} (serial ${v.serialNumber}${v.location ? `, ${v.location}` : ''}) is now: ${VESSEL_STATE_LABELS[view.state]}.`,
      '',
      ...view.stateReasons.map(r => `- ${r}`),
      ...(v.conditionReason ? [`- Recorded: ${v.conditionReason}`] : []),
      '',
      `Firings since the last routine service: ${n(v.firingsSinceService)} of ${n(v.serviceIntervalFirings)}.`,
      `Firings since the last requalification: ${n(v.firingsSinceRequalification)} of ${n(v.requalificationIntervalFirings)}.`,
      `Routine service due by ${view.serviceDueAt.toISOString().slice(0, 10)} (${view.daysUntilService >= 0 ? `in ${n(view.daysUntilService)} days` : `${n(-view.daysUntilService)} days ago`}).`,
      '',
      ...(firing ? [`${firing}.`] : []),
      `What to do: ${WHAT_TO_DO[view.state] ?? ''}`,
      `Open the vessel in Emberline: ${siteLink(`/vessels/${v.id}`)}`,
      '',
      `Combustion vessels hold oxygen under pressure. ${SAFETY}`,
      'Emberline sends this once for this change of state.',
    ].join('\n'),
  }
}
