// The fleet at a glance: every vessel's state, its service forecast from the recent firing
// rate, and the firing history of one vessel. Counts read the firings index within a bounded window only.
import { and, eq, gte, inArray, sql } from 'drizzle-orm'
import { forecastServiceDate } from '#shared/domain/vessel-state'
import type { VesselServiceState } from '#shared/domain/vessel-state'
import type { VesselView } from './vessels'

/** The recent firing rate is taken over this many days (four weeks: long enough to smooth a busy week). */
export const FORECAST_WINDOW_DAYS = 28
/** The firing chart of a vessel covers this many weeks. */
export const FIRING_CHART_WEEKS = 26
const DAY_MS = 86_400_000

/** Firings of each vessel since a date: one index range scan per vessel on (vessel_id, fired_at). */
export async function firingsSince(db: Db | Tx, vesselIds: string[], since: Date): Promise<Map<string, number>> {
  if (!vesselIds.length) return new Map()
  const v = schema.vessels
  const rows = await db.select({
    id: v.id,
    n: sql<number>`(select count(*)::int from ${schema.firings} f where f.vessel_id = ${v.id} and f.fired_at >= ${since})`,
  }).from(v).where(inArray(v.id, vesselIds))
  return new Map(rows.map(r => [r.id, Number(r.n)]))
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
  const f = schema.firings
  const week = sql<string>`to_char(date_trunc('week', ${f.firedAt} at time zone 'UTC'), 'YYYY-MM-DD')`
  const rows = await db.select({ week, n: sql<number>`count(*)::int` }).from(f)
    .where(and(eq(f.vesselId, vesselId), gte(f.firedAt, first))).groupBy(week)
  const byWeek = new Map(rows.map(r => [r.week, Number(r.n)]))
  return Array.from({ length: FIRING_CHART_WEEKS }, (_, i) => {
    const weekStart = new Date(first.getTime() + i * 7 * DAY_MS).toISOString().slice(0, 10)
    return { weekStart, firings: byWeek.get(weekStart) ?? 0 }
  })
}
