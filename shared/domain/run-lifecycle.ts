// The run lifecycle: which acts each status allows, who may sign a run, and what a run of each kind may burn.
// Pure rules, used by the server routes (authoritative) and by the pages (to show only the buttons that work).
import type { RunStatus } from '../schemas/plans'

export type RunAct = 'edit' | 'withdraw' | 'submit' | 'approve' | 'reject' | 'fire'

/** The statuses from which each act may start, and the status it leads to (submit goes by the verdict). */
export const RUN_TRANSITIONS: Readonly<Record<RunAct, { from: readonly RunStatus[], to: RunStatus | 'by-verdict' }>> = {
  // Editing sends the run back to draft: a signature given to the old charge no longer holds.
  edit: { from: ['draft', 'ready', 'awaiting-approval', 'blocked', 'rejected'], to: 'draft' },
  // A run that will not be fired is withdrawn, never deleted.
  withdraw: { from: ['draft', 'ready', 'awaiting-approval', 'blocked', 'rejected'], to: 'withdrawn' },
  submit: { from: ['draft'], to: 'by-verdict' },
  approve: { from: ['awaiting-approval'], to: 'ready' },
  reject: { from: ['awaiting-approval'], to: 'rejected' },
  fire: { from: ['ready'], to: 'fired' },
}

export function runAllows(act: RunAct, status: string): boolean {
  return (RUN_TRANSITIONS[act].from as readonly string[]).includes(status)
}

const ACT_WORDS: Record<RunAct, string> = { edit: 'changed', withdraw: 'withdrawn', submit: 'submitted', approve: 'approved', reject: 'rejected', fire: 'fired' }
const STATUS_WHY: Partial<Record<RunStatus, string>> = {
  'fired': 'it has already been fired',
  'withdrawn': 'it has been withdrawn',
  'blocked': 'it is blocked: change the charge or withdraw the run',
  'awaiting-approval': 'it awaits a supervisor\'s signature',
  'draft': 'it is a draft: submit the plan first',
  'rejected': 'it was rejected: change the charge and submit it again',
  'ready': 'it is already cleared and ready to fire',
}

/** Null when the act is allowed; otherwise the sentence that says why not, in the lab's words. */
export function runActRefusal(act: RunAct, status: string, sampleCode?: string): string | null {
  if (runAllows(act, status)) return null
  const what = sampleCode ? `Run ${sampleCode}` : 'This run'
  return `${what} cannot be ${ACT_WORDS[act]}: ${STATUS_WHY[status as RunStatus] ?? `it is ${status}`}.`
}

export interface RunHandlers {
  plannedBy: string
  editedBy?: readonly string[] | null
  submittedBy?: readonly string[] | null
}

/**
 * Separation of duties (common practice for electronic signatures on regulated records): nobody signs a record
 * they had a hand in, whatever roles they hold. `involvement` maps what was done ("planned", "fired") to who did
 * it; null when the signer did none of it, otherwise the sentence that says so.
 */
export function dutyConflict(signerId: string, what: string, involvement: Record<string, readonly (string | null | undefined)[]>): string | null {
  const did = Object.entries(involvement).filter(([, ids]) => ids.includes(signerId)).map(([verb]) => verb)
  if (!did.length) return null
  const list = did.length > 1 ? `${did.slice(0, -1).join(', ')} and ${did.at(-1)}` : did[0]
  return `You ${list} ${what}: another supervisor must sign it (separation of duties, whatever roles you hold).`
}

/** Nobody signs a charge they planned, edited or submitted. */
export function runDutyConflict(run: RunHandlers, signerId: string): string | null {
  return dutyConflict(signerId, 'this run', { planned: [run.plannedBy], edited: run.editedBy ?? [], submitted: run.submittedBy ?? [] })
}

/** Adds a person to a list of handlers once. */
export function withHandler(list: readonly string[] | null | undefined, userId: string): string[] {
  const out = [...(list ?? [])]
  if (!out.includes(userId)) out.push(userId)
  return out
}

/** The library category of the material a standardisation or check run must burn as its sample. */
export const REFERENCE_STANDARD_CATEGORY = 'reference standard'

export interface SampleIdentity { index: number, materialId?: string | null, materialName?: string | null, category?: string | null, description?: string | null }

/**
 * Standardisation and check runs burn the lab's reference standard and nothing else (ISO 1928 and ASTM D5865 calibrate
 * and check with certified benzoic acid, from memory): every sample component names a library material of category
 * "reference standard". Returns one problem per offending component (empty when the run is sound).
 */
export function runKindProblems(kind: string, samples: readonly SampleIdentity[]): { index: number, message: string }[] {
  if (kind !== 'standardisation' && kind !== 'check') return []
  const run = kind === 'check' ? 'a check run' : 'a standardisation run'
  if (!samples.length) return [{ index: -1, message: `${run} burns the lab's reference standard: add it as the sample` }]
  return samples.flatMap((s) => {
    if (s.category === REFERENCE_STANDARD_CATEGORY) return []
    const what = s.materialId
      ? `${s.materialName ?? 'this material'} is a ${s.category ?? 'library material'}, not a reference standard`
      : `${s.description ? `"${s.description}"` : 'this sample'} is not a library reference standard`
    return [{ index: s.index, message: `${run} burns the lab's reference standard (a library material of category "reference standard") and nothing else: ${what}` }]
  })
}
