// The proposal (or a re-checked edit) as the page shows it, with each vessel's service forecast counting accepted day plans.
import { forecastWithPlans, layoutDay, proposeDay } from '#shared/domain/day-plan'
import type { DayPlanProposal } from '#shared/domain/day-plan'
import type { LabPolicy } from '#shared/domain/policy'
import type { DayPlanRequest } from '#shared/schemas/day-plans'

export async function dayPlanAnswer(db: Db | Tx, input: DayPlanRequest, policy: LabPolicy) {
  const ctx = await loadDayContext(db, input.day, input.vesselIds, policy)
  const proposal: DayPlanProposal = input.assignment
    ? layoutDay(ctx.vessels, ctx.runs, input.assignment, ctx.assessOn, ctx.settings)
    : proposeDay(ctx.vessels, ctx.runs, ctx.assessOn, ctx.settings)
  // Assignments naming a vessel outside the chosen set are problems too.
  for (const [vesselId, runIds] of Object.entries(input.assignment ?? {})) {
    if (!input.vesselIds.includes(vesselId)) for (const runId of runIds) proposal.problems.push({ runId, vesselId, message: 'this vessel is not among the chosen vessels' })
  }
  const forecasts: Record<string, { dueAt: Date, by: 'firings' | 'calendar', firingsUntilService: number, state: string }> = {}
  for (const v of proposal.vessels) {
    const current = ctx.views.get(v.vesselId)!
    const planned = [
      ...ctx.ahead.filter(a => a.vesselId === v.vesselId && a.day !== input.day).map(a => ({ day: new Date(`${a.day}T00:00:00Z`), firings: a.firings })),
      { day: new Date(`${input.day}T00:00:00Z`), firings: v.firings.length + (ctx.ahead.find(a => a.vesselId === v.vesselId && a.day === input.day)?.firings ?? 0) },
    ]
    const f = forecastWithPlans(current.firingsUntilService, current.serviceDueAt, planned)
    forecasts[v.vesselId] = { dueAt: f.dueAt, by: f.by, firingsUntilService: current.firingsUntilService, state: current.state }
  }
  return { day: input.day, settings: ctx.settings, ...proposal, forecasts, views: ctx.views }
}
