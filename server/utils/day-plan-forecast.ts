// The service date each vessel reaches at the pace of its accepted day plans ("due on Thursday at this pace").
import { forecastWithPlans } from '#shared/domain/day-plan'

type ForecastVessel = { id: string, firingsUntilService: number, serviceDueAt: Date | string }
type Ahead = Awaited<ReturnType<typeof plannedFirings>>

function forecastFor(v: ForecastVessel, ahead: Ahead) {
  const days = ahead.filter(a => a.vesselId === v.id).sort((a, b) => a.day.localeCompare(b.day)).map(a => ({ day: a.day, firings: a.firings }))
  const f = forecastWithPlans(v.firingsUntilService, new Date(v.serviceDueAt), days.map(d => ({ day: new Date(`${d.day}T00:00:00Z`), firings: d.firings })))
  return { days, plannedFirings: days.reduce((n, d) => n + d.firings, 0), dueAt: f.dueAt, by: f.by }
}

/** Per vessel with planned firings ahead: the day the accepted day plans use up its firings before service, or null when the calendar comes first. */
export async function plannedServiceDates(db: Db | Tx, views: ForecastVessel[], now = new Date()) {
  const ahead = await plannedFirings(db, now.toISOString().slice(0, 10))
  const out = new Map<string, { dueAt: Date, plannedFirings: number } | null>()
  for (const v of views) {
    const f = forecastFor(v, ahead)
    if (!f.days.length) continue
    out.set(v.id, f.by === 'firings' ? { dueAt: f.dueAt, plannedFirings: f.plannedFirings } : null)
  }
  return out
}

/** One vessel's firings booked on accepted day plans from today on, by day, and when routine service falls due at that pace. */
export async function vesselDayPlanForecast(db: Db | Tx, view: ForecastVessel, now = new Date()) {
  const f = forecastFor(view, await plannedFirings(db, now.toISOString().slice(0, 10)))
  return { ...f, firingsUntilService: view.firingsUntilService, firingsLeftAfter: view.firingsUntilService - f.plannedFirings }
}
