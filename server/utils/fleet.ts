// The fleet at a glance: every vessel's state, its service forecast from the recent firing
// rate, and the firing history of one vessel. Counts read the firings index within a bounded window only.
import { and, eq, gt, gte, inArray, lt, sql } from 'drizzle-orm'
import { unionAll } from 'drizzle-orm/pg-core'
import { forecastServiceDate } from '#shared/domain/vessel-state'
import type { VesselServiceState } from '#shared/domain/vessel-state'
import type { VesselView } from './vessels'

/** The recent firing rate is taken over this many days (four weeks: long enough to smooth a busy week). */
export const FORECAST_WINDOW_DAYS = 28
/** The firing chart of a vessel covers this many weeks. */
export const FIRING_CHART_WEEKS = 26
const DAY_MS = 86_400_000

/**
 * Firings of each vessel since a date. Whole UTC days after the first come from the daily tally (vessel_firing_days,
 * kept by triggers on firings); only the part of the first day from `since` on is counted in the firings index. On the
 * large lab this reads about 1,500 tally rows instead of 67,000 index entries (docs/benchmarks.md).
 */
export async function firingsSince(db: Db | Tx, vesselIds: string[], since: Date): Promise<Map<string, number>> {
  if (!vesselIds.length) return new Map()
  const f = schema.firings
  const d = schema.vesselFiringDays
  const firstDay = since.toISOString().slice(0, 10)
  const nextDayStart = new Date(Date.parse(`${firstDay}T00:00:00Z`) + DAY_MS)
  // Grouped on the tables themselves: a correlated sub-select rendered the vessel's "id" unqualified, and
  // PostgreSQL resolved it to the firing's own id, so every vessel counted 0.
  // One round trip: on this machine each query costs its socket write and read in the server's CPU (docs/benchmarks.md).
  const days = db.select({ id: d.vesselId, n: sql<number>`sum(${d.firings})::int`.as('n') }).from(d)
    .where(and(inArray(d.vesselId, vesselIds), gt(d.day, firstDay))).groupBy(d.vesselId)
  const partial = db.select({ id: f.vesselId, n: sql<number>`count(*)::int`.as('n') }).from(f)
    .where(and(inArray(f.vesselId, vesselIds), gte(f.firedAt, since), lt(f.firedAt, nextDayStart))).groupBy(f.vesselId)
  const rows = await unionAll(days, partial)
  const counts = new Map(vesselIds.map(id => [id, 0]))
  for (const r of rows) counts.set(r.id, (counts.get(r.id) ?? 0) + Number(r.n))
  return counts
}

export interface ServiceForecast {
  firingsInWindow: number
  windowDays: number
  firingsPerWeek: number
  /** The date the vessel is expected to fall due for its routine service, or null for a retired vessel. */
  serviceDueForecastAt: Date | null
  /** 'firings' when the firing rate brings it due before the calendar date, else 'calendar'. */
  decidedBy: 'firings' | 'calendar' | null
}

/** Forecast from the one state function's forecastServiceDate, with the rate over the last 28 days (or since registration, if younger). */
export function serviceForecast(view: VesselView, firingsInWindow: number, now: Date): ServiceForecast {
  const ageDays = (now.getTime() - new Date(view.registeredAt).getTime()) / DAY_MS
  const windowDays = Math.min(FORECAST_WINDOW_DAYS, Math.max(1, ageDays))
  const perDay = firingsInWindow / windowDays
  const base = { firingsInWindow, windowDays: Math.round(windowDays), firingsPerWeek: Math.round(perDay * 7 * 10) / 10 }
  if (view.state === 'retired') return { ...base, serviceDueForecastAt: null, decidedBy: null }
  const state: VesselServiceState = {
    state: view.state,
    serviceDueAt: new Date(view.serviceDueAt),
    firingsUntilService: view.firingsUntilService,
    daysUntilService: view.daysUntilService,
    firingsUntilRequalification: view.firingsUntilRequalification,
    reasons: view.stateReasons,
    blocksSampleRuns: view.blocksSampleRuns,
    blocksAllFirings: view.blocksAllFirings,
    evaluatedAt: now,
  }
  const at = forecastServiceDate(state, perDay)
  return { ...base, serviceDueForecastAt: at, decidedBy: at.getTime() < state.serviceDueAt.getTime() ? 'firings' : 'calendar' }
}

/** Monday 00:00 UTC of the week holding `d` (ISO 8601 weeks, as PostgreSQL's date_trunc('week')). */
export function weekStartUtc(d: Date): Date {
  const day = new Date(Date.UTC(d.getUTCFullYear(), d.getUTCMonth(), d.getUTCDate()))
  const back = (day.getUTCDay() + 6) % 7
  return new Date(day.getTime() - back * DAY_MS)
}

/** Firings per week over the last 26 weeks (this week included), zero weeks filled in. */
export async function weeklyFirings(db: Db | Tx, vesselId: string, now = new Date()) {
  const first = new Date(weekStartUtc(now).getTime() - (FIRING_CHART_WEEKS - 1) * 7 * DAY_MS)
  const d = schema.vesselFiringDays
  // `first` is a Monday 00:00 UTC, so whole days of the tally cover the weeks exactly.
  const week = sql<string>`to_char(date_trunc('week', ${d.day}), 'YYYY-MM-DD')`
  const rows = await db.select({ week, n: sql<number>`sum(${d.firings})::int` }).from(d)
    .where(and(eq(d.vesselId, vesselId), gte(d.day, first.toISOString().slice(0, 10)))).groupBy(week)
  const byWeek = new Map(rows.map(r => [r.week, Number(r.n)]))
  return Array.from({ length: FIRING_CHART_WEEKS }, (_, i) => {
    const weekStart = new Date(first.getTime() + i * 7 * DAY_MS).toISOString().slice(0, 10)
    return { weekStart, firings: byWeek.get(weekStart) ?? 0 }
  })
}

/**
 * One vessel as Today shows it: name, state, counters, due date and forecast. The vessel page has the rest (ratings,
 * proof charge, notes); leaving it out halves the Today answer and its server-rendered payload on a large lab.
 */
export function fleetRow(view: VesselView, forecast: ServiceForecast & { dayPlans: { dueAt: Date, plannedFirings: number } | null }) {
  return {
    id: view.id,
    name: view.name,
    class: view.class,
    location: view.location,
    state: view.state,
    stateReasons: view.stateReasons,
    conditionReason: view.conditionReason,
    firingsSinceService: view.firingsSinceService,
    serviceIntervalFirings: view.serviceIntervalFirings,
    firingsSinceRequalification: view.firingsSinceRequalification,
    requalificationIntervalFirings: view.requalificationIntervalFirings,
    firingsTotal: view.firingsTotal,
    serviceDueAt: view.serviceDueAt,
    daysUntilService: view.daysUntilService,
    forecast,
  }
}
