// Everything the day plan needs from the database: the chosen vessels as they will stand that morning, the runs open
// for planning (planned from received samples, not yet fired nor on an accepted day plan), and the real charge
// assessment of each run on each vessel.
import { and, desc, eq, gte, inArray, isNotNull, isNull, notInArray, sql } from 'drizzle-orm'
import { assessCharge, chargeInputSchema, resolveComponents } from '#shared/domain/assessment'
import type { ChargeInput } from '#shared/domain/assessment'
import type { AssessOn, DaySettings, PlanRun, PlanVessel } from '#shared/domain/day-plan'
import type { LabPolicy } from '#shared/domain/policy'


const DAY_MS = 86_400_000
export const OPEN_FOR_DAY_PLAN = ['draft', 'ready', 'awaiting-approval'] as const

export function daySettings(day: string, policy: LabPolicy): DaySettings {
  const dayStart = new Date(`${day}T00:00:00Z`)
  dayStart.setUTCHours(policy.workdayStartHour)
  return { dayStart, workdayMinutes: policy.workdayHours * 60, cycleMinutes: policy.firingCycleMinutes }
}

/** Firings each vessel still has on accepted day plans, by day: runs not yet fired nor withdrawn (and the check slots of plans accepted before those became runs). */
export async function plannedFirings(db: Db | Tx, fromDay: string) {
  const plans = await db.select().from(schema.dayPlans).where(gte(schema.dayPlans.day, fromDay))
  if (!plans.length) return [] as { day: string, vesselId: string, firings: number }[]
  const open = await db.select({ dayPlanId: schema.runs.dayPlanId, vesselId: schema.runs.vesselId, n: sql<number>`count(*)::int` }).from(schema.runs)
    .where(and(inArray(schema.runs.dayPlanId, plans.map(p => p.id)), notInArray(schema.runs.status, ['fired', 'withdrawn', 'rejected']))).groupBy(schema.runs.dayPlanId, schema.runs.vesselId)
  const out: { day: string, vesselId: string, firings: number }[] = []
  for (const p of plans) {
    const proposal = p.proposal
    for (const v of proposal.vessels) {
      const checks = v.firings.filter(f => f.runId === null).length
      const runs = open.find(o => o.dayPlanId === p.id && o.vesselId === v.vesselId)?.n ?? 0
      if (checks + runs) out.push({ day: p.day, vesselId: v.vesselId, firings: checks + runs })
    }
  }
  return out
}

export async function loadDayContext(db: Db | Tx, day: string, vesselIds: string[], policy: LabPolicy) {
  const settings = daySettings(day, policy)
  const rows = await db.select().from(schema.vessels).where(inArray(schema.vessels.id, vesselIds))
  const missing = vesselIds.filter(id => !rows.some(r => r.id === id))
  if (missing.length) invalidInput(missing.map(id => ({ path: `vesselIds.${vesselIds.indexOf(id)}`, message: 'no such vessel' })))
  const ees = await db.select().from(schema.energyEquivalents).where(and(inArray(schema.energyEquivalents.vesselId, vesselIds), eq(schema.energyEquivalents.active, true))).orderBy(desc(schema.energyEquivalents.acceptedAt))
  const ahead = await plannedFirings(db, new Date().toISOString().slice(0, 10))
  const views = new Map(rows.map(r => [r.id, vesselView(r, policy, settings.dayStart)]))
  const vessels: PlanVessel[] = rows.map((r) => {
    const v = views.get(r.id)!
    // Firings already promised on accepted day plans up to and including this day count against the limits.
    const before = ahead.filter(a => a.vesselId === r.id && a.day < day).reduce((n, a) => n + a.firings, 0)
    const sameDay = ahead.filter(a => a.vesselId === r.id && a.day === day).reduce((n, a) => n + a.firings, 0)
    const ee = ees.find(e => e.vesselId === r.id)
    let firstNeeds: PlanVessel['firstNeeds'] = null
    // A check placed by an accepted plan of the same day already opens that day.
    if (sameDay > 0) firstNeeds = null
    // A check is judged against the energy equivalent: a serviced vessel without one is standardised first.
    else if (v.state === 'awaiting-verification' && !ee) firstNeeds = { kind: 'standardisation', firings: policy.standardisationRuns, reason: `${v.name} was serviced and has no energy equivalent on record: a standardisation series of ${policy.standardisationRuns} runs first (lab policy); the check run that returns it to samples follows once the energy equivalent is accepted.` }
    else if (v.state === 'awaiting-verification') firstNeeds = { kind: 'check', firings: 1, reason: `${v.name} was serviced: a check run with the reference standard must pass before any sample (vessel state).` }
    else if (!ee) firstNeeds = { kind: 'standardisation', firings: policy.standardisationRuns, reason: `No energy equivalent on record for ${v.name}: a standardisation series of ${policy.standardisationRuns} runs first (lab policy).` }
    else {
      const age = Math.floor((settings.dayStart.getTime() - ee.acceptedAt.getTime()) / DAY_MS)
      if (age > policy.energyEquivalentMaxAgeDays) firstNeeds = { kind: 'check', firings: 1, reason: `The energy equivalent of ${v.name} was accepted ${age} days before this day; the lab asks for a check run after ${policy.energyEquivalentMaxAgeDays} days.` }
    }
    return {
      id: r.id, name: r.name, blocksAllFirings: v.blocksAllFirings, blocksSampleRuns: v.blocksSampleRuns, stateReason: v.stateReasons[0] ?? v.state,
      firingsUntilService: v.firingsUntilService - before - sameDay, firingsUntilRequalification: v.firingsUntilRequalification - before - sameDay,
      serviceDueAt: v.serviceDueAt, alreadyPlannedToday: sameDay, firstNeeds,
    }
  })

  const open = await db.select({ run: schema.runs, receivedAt: schema.samples.receivedAt }).from(schema.runs)
    .innerJoin(schema.samples, eq(schema.samples.id, schema.runs.sampleId))
    .where(and(isNotNull(schema.runs.sampleId), isNull(schema.runs.dayPlanId), inArray(schema.runs.status, [...OPEN_FOR_DAY_PLAN])))
  const runs: PlanRun[] = open.map(o => ({ id: o.run.id, sampleId: o.run.sampleId, label: `${o.run.sampleCode} #${o.run.seq}`, kind: o.run.kind as PlanRun['kind'], priority: o.receivedAt.getTime() }))

  // The charge of each run resolved once (duplicates share it), then assessed on each vessel: the same assessment as the run page.
  const charges = new Map<string, ChargeInput | null>()
  const byRun = new Map(open.map(o => [o.run.id, o.run]))
  for (const o of open) {
    const key = JSON.stringify([o.run.components, o.run.fillPressureMPa, o.run.kind])
    if (charges.has(key)) continue
    try {
      const components = await buildCharge(db, o.run.components)
      const anyVessel = assessmentVessel(views.values().next().value!)
      const parsed = chargeInputSchema.parse({ vessel: anyVessel, fillPressureMPa: o.run.fillPressureMPa, components, runRole: o.run.kind })
      // The schema drops `library`: the material's own record is attached again, as the run page's assessment does.
      parsed.components.forEach((c, i) => {
        const library = components[i]?.library
        if (library) (c as typeof components[number]).library = library
      })
      charges.set(key, { ...parsed, components: await resolveComponents(parsed.components) } as ChargeInput)
    }
    catch {
      charges.set(key, null)
    }
  }
  const cache = new Map<string, ReturnType<AssessOn>>()
  const assessOn: AssessOn = (run, vessel) => {
    const r = byRun.get(run.id)!
    const chargeKey = JSON.stringify([r.components, r.fillPressureMPa, r.kind])
    // Duplicates share one charge, so one assessment per charge and vessel.
    const k = `${chargeKey}|${vessel.id}`
    const hit = cache.get(k)
    if (hit) return hit
    const charge = charges.get(chargeKey)
    let out: ReturnType<AssessOn>
    if (!charge) out = { verdict: 'blocked', reason: 'the charge cannot be assessed; open the run and correct it' }
    else {
      const a = assessCharge({ ...charge, vessel: assessmentVessel(views.get(vessel.id)!) }, policy)
      out = { verdict: a.verdict, reason: a.findings.find(f => f.severity === 'block')?.message }
    }
    cache.set(k, out)
    return out
  }
  return { settings, vessels, views, runs, assessOn, ahead }
}
