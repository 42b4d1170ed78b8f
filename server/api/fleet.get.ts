import type { RunStatus } from '#shared/schemas/plans'
import { runDutyConflict } from '#shared/domain/run-lifecycle'
import { asc, desc, eq, sql } from 'drizzle-orm'

// Vessels a technician should look at first, most urgent first.
const ATTENTION: Record<string, number> = { 'locked-out': 0, 'overdue': 1, 'requalification-due': 2, 'awaiting-verification': 3, 'service-due': 4, 'away': 5 }
const QUEUE_ROWS = 20

// Today: every vessel with its state, counters and service forecast (fleetRow: what the page shows), and the queues of the caller's roles.
export default defineEventHandler(async (event) => {
  const user = await requireUser(event)
  const db = useDb()
  const now = new Date()
  const [rows, policy] = await Promise.all([db.select().from(schema.vessels).orderBy(asc(schema.vessels.name)), getPolicy()])
  const views = rows.map(r => vesselView(r, policy, now))
  // Accepted day plans ahead can bring service sooner than the recent rate says.
  const [recent, planned] = await Promise.all([
    firingsSince(db, rows.map(r => r.id), new Date(now.getTime() - FORECAST_WINDOW_DAYS * 86_400_000)),
    plannedServiceDates(db, views, now),
  ])
  const vessels = views.map(view => fleetRow(view, { ...serviceForecast(view, recent.get(view.id) ?? 0, now), dayPlans: planned.get(view.id) ?? null }))

  // One query per queue: the rows shown and, in each row, the count of all waiting (a window over the whole match).
  const runList = async (status: RunStatus, order: 'oldest' | 'plan') => {
    const rows = await db.select({
      id: schema.runs.id, planId: schema.runs.planId, seq: schema.runs.seq, sampleCode: schema.runs.sampleCode, kind: schema.runs.kind,
      status: schema.runs.status, verdict: schema.runs.verdict, fillPressureMPa: schema.runs.fillPressureMPa, updatedAt: schema.runs.updatedAt,
      plannedBy: schema.runs.plannedBy, editedBy: schema.runs.editedBy, submittedBy: schema.runs.submittedBy, planName: schema.plans.name, plannerName: schema.users.name, vesselId: schema.runs.vesselId, vesselName: schema.vessels.name,
      waiting: sql<number>`count(*) over ()`.mapWith(Number),
    }).from(schema.runs)
      .innerJoin(schema.plans, eq(schema.plans.id, schema.runs.planId))
      .innerJoin(schema.users, eq(schema.users.id, schema.runs.plannedBy))
      .innerJoin(schema.vessels, eq(schema.vessels.id, schema.runs.vesselId))
      .where(eq(schema.runs.status, status))
      .orderBy(...(order === 'oldest' ? [asc(schema.runs.updatedAt)] : [desc(schema.plans.createdAt), asc(schema.runs.seq)]))
      .limit(QUEUE_ROWS)
    return { count: rows[0]?.waiting ?? 0, runs: rows.map(({ waiting: _w, ...r }) => r) }
  }
  type QueueRun = Awaited<ReturnType<typeof runList>>['runs'][number] & { ownRun: boolean }

  const queues: {
    approvals?: { count: number, runs: QueueRun[] }
    ready?: { count: number, runs: QueueRun[] }
    attention?: { count: number, vessels: typeof vessels }
  } = {}
  if (hasRole(user, 'supervisor')) {
    const { count, runs } = await runList('awaiting-approval', 'oldest')
    // A supervisor who planned, edited or submitted a waiting run may not sign it: it is marked as their own.
    queues.approvals = { count, runs: runs.map(r => ({ ...r, ownRun: runDutyConflict(r, user.id) !== null })) }
  }
  if (hasRole(user, 'analyst')) {
    const { count, runs } = await runList('ready', 'plan')
    queues.ready = { count, runs: runs.map(r => ({ ...r, ownRun: r.plannedBy === user.id })).sort((a, b) => Number(b.ownRun) - Number(a.ownRun)) }
  }
  if (hasRole(user, 'technician')) {
    const list = vessels.filter(v => v.state in ATTENTION).sort((a, b) => ATTENTION[a.state]! - ATTENTION[b.state]! || a.name.localeCompare(b.name))
    queues.attention = { count: list.length, vessels: list }
  }
  return { generatedAt: now, forecastWindowDays: FORECAST_WINDOW_DAYS, vessels, queues }
})
