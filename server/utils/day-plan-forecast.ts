// The service date each vessel reaches at the pace of its accepted day plans ("due on Thursday at this pace").
import { forecastWithPlans } from '#shared/domain/day-plan'

/** Per vessel with planned firings ahead: the day the accepted day plans use up its firings before service, or null when the calendar comes first. */
export async function plannedServiceDates(db: Db | Tx, views: { id: string, firingsUntilService: number, serviceDueAt: Date | string }[], now = new Date()) {
  const ahead = await plannedFirings(db, now.toISOString().slice(0, 10))
  const out = new Map<string, { dueAt: Date, plannedFirings: number } | null>()
  for (const v of views) {
    const mine = ahead.filter(a => a.vesselId === v.id).map(a => ({ day: new Date(`${a.day}T00:00:00Z`), firings: a.firings }))
    if (!mine.length) continue
    const f = forecastWithPlans(v.firingsUntilService, new Date(v.serviceDueAt), mine)
    out.set(v.id, f.by === 'firings' ? { dueAt: f.dueAt, plannedFirings: mine.reduce((n, p) => n + p.firings, 0) } : null)
  }
  return out
}
