// Vessel reminders: when a vessel's state changes to one that needs someone's hands, technicians
// and supervisors get one e-mail — once per change, however many workers or app instances look at the same time.
import type { H3Event } from 'h3'
import { and, asc, eq, inArray, sql } from 'drizzle-orm'
import type { LabPolicy } from '#shared/domain/policy'
import type { VesselState } from '#shared/domain/vessel-state'
import type { VesselRow } from './vessels'

/** States that are mailed when a vessel enters them; any other state is recorded silently. */
export const REMINDER_STATES: ReadonlySet<VesselState> = new Set(['service-due', 'overdue', 'requalification-due', 'locked-out'])

/** The pg-boss queue the fleet check runs on. */
export const FLEET_CHECK_QUEUE = 'emberline-fleet-check'

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

export interface TransitionResult { vesselId: string, name: string, from: string | null, to: VesselState, claimed: boolean, mailed: boolean, dedupeKey: string | null }

/**
 * Records the vessel's current state as told, inside the caller's transaction: the conditional UPDATE
 * claims the change (a second worker finds nothing left to claim) and, for a state that needs someone,
 * the e-mail is queued in the same transaction with a dedupe key — so it is sent once or not at all.
 */
export async function notifyVesselTransition(tx: Tx, event: Pick<H3Event, 'context'> | null, v: VesselRow, policy: LabPolicy, now = new Date()): Promise<TransitionResult> {
  const view = vesselView(v, policy, now)
  const result: TransitionResult = { vesselId: v.id, name: v.name, from: v.notifiedState, to: view.state, claimed: false, mailed: false, dedupeKey: null }
  if (view.state === v.notifiedState) return result
  const claimed = await tx.execute(sql`UPDATE vessels SET notified_state = ${view.state} WHERE id = ${v.id} AND notified_state IS DISTINCT FROM ${view.state} RETURNING id`)
  result.claimed = claimed.rows.length > 0
  if (!result.claimed || !REMINDER_STATES.has(view.state)) return result
  if (view.state === 'locked-out' && await lockedOutByFiring(tx, v)) return result
  const to = [...new Set([...await recipientsWithRole(tx, 'technician'), ...await recipientsWithRole(tx, 'supervisor')])]
  result.dedupeKey = reminderKey(v, view.state)
  result.mailed = await enqueueMail(tx, { to, ...vesselReminderMail(v, view), dedupeKey: result.dedupeKey })
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
