// Vessel reminders: when a vessel's state changes to one that needs someone's hands, technicians
// and supervisors get one e-mail — once per change, however many workers or app instances look at the same time.
import type { H3Event } from 'h3'
import { and, asc, eq, inArray, sql } from 'drizzle-orm'
import { VESSEL_STATE_LABELS } from '#shared/labels'
import type { LabPolicy } from '#shared/domain/policy'
import type { VesselState } from '#shared/domain/vessel-state'
import type { VesselRow } from './vessels'

/** States that are mailed when a vessel enters them; any other state is recorded silently. */
export const REMINDER_STATES: ReadonlySet<VesselState> = new Set(['service-due', 'overdue', 'requalification-due', 'locked-out'])

/** The pg-boss queue the fleet check runs on. */
export const FLEET_CHECK_QUEUE = 'emberline-fleet-check'

const WHAT_TO_DO: Partial<Record<VesselState, string>> = {
  'service-due': 'Plan the routine seal service: every seal renewed together, the valve seat renewed, then a leak test under water and the electrode resistance check.',
  'overdue': 'The vessel cannot be planned or fired until its routine service is recorded in Emberline.',
  'requalification-due': 'Send the vessel for requalification (hydrostatic or proof test and dimensional inspection) before any further firing.',
  'locked-out': 'Do not fill or fire the vessel. It returns to service only with a signed return-to-service record after a passing requalification (or, for a failed leak test or electrode check, a routine service that passes both).',
}

/** The start of the episode a state belongs to, so a repeat of the same state in the same episode is never mailed twice. */
function episodeStart(v: VesselRow, state: VesselState): Date {
  if (state === 'locked-out' || state === 'away' || state === 'retired' || state === 'awaiting-verification') return v.conditionSince ?? v.updatedAt
  if (state === 'requalification-due') return v.lastRequalifiedAt ?? v.registeredAt
  return v.lastServicedAt ?? v.registeredAt
}

/** The outbox key of a reminder: `vessel:<id>:<state>:<since>`. */
export function reminderKey(v: VesselRow, state: VesselState): string {
  return `vessel:${v.id}:${state}:${episodeStart(v, state).toISOString()}`
}

function reminderText(v: VesselRow, view: ReturnType<typeof vesselView>): string {
  const n = (x: number) => x.toLocaleString('en-GB')
  const lines = [
    `${v.name} (serial ${v.serialNumber}${v.location ? `, ${v.location}` : ''}) is now: ${VESSEL_STATE_LABELS[view.state]}.`,
    '',
    ...view.stateReasons.map(r => `- ${r}`),
    ...(v.conditionReason ? [`- Recorded: ${v.conditionReason}`] : []),
    '',
    `Firings since the last routine service: ${n(v.firingsSinceService)} of ${n(v.serviceIntervalFirings)}.`,
    `Firings since the last requalification: ${n(v.firingsSinceRequalification)} of ${n(v.requalificationIntervalFirings)}.`,
    `Routine service due by ${view.serviceDueAt.toISOString().slice(0, 10)} (${view.daysUntilService >= 0 ? `in ${n(view.daysUntilService)} days` : `${n(-view.daysUntilService)} days ago`}).`,
    '',
    `What to do: ${WHAT_TO_DO[view.state] ?? ''}`,
    `Open the vessel in Emberline: Vessels → ${v.name} (/vessels/${v.id}).`,
    '',
    'Combustion vessels hold oxygen under pressure. Local regulations, the vessel maker\'s instructions and the lab\'s own procedures come first.',
    'Emberline sends this once for this change of state.',
  ]
  return lines.join('\n')
}

export interface TransitionResult { vesselId: string, name: string, from: string | null, to: VesselState, claimed: boolean, mailed: boolean, dedupeKey: string | null }

/**
 * Records the vessel's current state as told, inside the caller's transaction: the conditional UPDATE
 * claims the change (a second worker finds nothing left to claim) and, for a state that needs someone,
 * the e-mail is queued in the same transaction with a dedupe key — so it is sent once or not at all.
 */
export async function notifyVesselTransition(tx: Tx, event: H3Event | null, v: VesselRow, policy: LabPolicy, now = new Date()): Promise<TransitionResult> {
  const view = vesselView(v, policy, now)
  const result: TransitionResult = { vesselId: v.id, name: v.name, from: v.notifiedState, to: view.state, claimed: false, mailed: false, dedupeKey: null }
  if (view.state === v.notifiedState) return result
  const claimed = await tx.execute(sql`UPDATE vessels SET notified_state = ${view.state} WHERE id = ${v.id} AND notified_state IS DISTINCT FROM ${view.state} RETURNING id`)
  result.claimed = claimed.rows.length > 0
  if (!result.claimed || !REMINDER_STATES.has(view.state)) return result
  if (view.state === 'locked-out' && await lockedOutByFiring(tx, v)) return result
  const to = [...new Set([...await recipientsWithRole(tx, 'technician'), ...await recipientsWithRole(tx, 'supervisor')])]
  result.dedupeKey = reminderKey(v, view.state)
  result.mailed = await enqueueMail(tx, { to, subject: `${v.name}: ${VESSEL_STATE_LABELS[view.state]}`, text: reminderText(v, view), dedupeKey: result.dedupeKey })
  if (result.mailed) {
    await audit(tx, event, { action: 'vessel.reminder', entity: 'vessel', entityId: v.id, oldValues: { notifiedState: v.notifiedState }, newValues: { state: view.state, to, dedupeKey: result.dedupeKey } })
  }
  return result
}

/** True when a leak or overpressure firing started this lock-out: the firing route mails those itself (server/utils/firing.ts). */
async function lockedOutByFiring(tx: Tx, v: VesselRow): Promise<boolean> {
  if (!v.conditionSince) return false
  const f = schema.firings
  const [hit] = await tx.select({ id: f.id }).from(f)
    .where(and(eq(f.vesselId, v.id), eq(f.firedAt, v.conditionSince), inArray(f.outcome, ['leak', 'overpressure']))).limit(1)
  return !!hit
}

export interface FleetCheckReport { checkedAt: Date, vessels: number, transitions: TransitionResult[] }

/**
 * The fleet check: every vessel's state from the one state function; each vessel whose state differs from
 * the last one told is re-read under a row lock and claimed in its own short transaction.
 */
export async function runFleetCheck(event: H3Event | null = null): Promise<FleetCheckReport> {
  const db = useDb()
  const policy = await getPolicy()
  const now = new Date()
  const rows = await db.select().from(schema.vessels).orderBy(asc(schema.vessels.name))
  const transitions: TransitionResult[] = []
  for (const row of rows) {
    if (vesselView(row, policy, now).state === row.notifiedState) continue
    const r = await db.transaction(async (tx) => {
      const [fresh] = await tx.select().from(schema.vessels).where(eq(schema.vessels.id, row.id)).for('update')
      return fresh ? await notifyVesselTransition(tx, event, fresh, policy, now) : null
    })
    if (r?.claimed) transitions.push(r)
  }
  return { checkedAt: now, vessels: rows.length, transitions }
}
