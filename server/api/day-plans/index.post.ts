import { asc, eq, inArray } from 'drizzle-orm'
import { dayPlanAcceptSchema } from '#shared/schemas/day-plans'

// Accepts a day plan: re-checked by the same rules inside the transaction (422 naming each problem), then each run
// takes its vessel and order; a run moved to another vessel is assessed again there (its signature, if any, no longer
// covers the charge and a new one is needed where the verdict asks for it). The check or standardisation firings a
// vessel starts with become runs of their own, ready to fire.
export default defineEventHandler(async (event) => {
  await requireRole(event)
  const input = await parseBody(event, dayPlanAcceptSchema)
  const policy = await getPolicy()
  const result = await useDb().transaction(async (tx) => {
    // Accepting day plans for the same vessels one after the other: the second sees the first (and its check runs).
    await tx.select({ id: schema.vessels.id }).from(schema.vessels).where(inArray(schema.vessels.id, input.vesselIds)).orderBy(asc(schema.vessels.id)).for('update')
    const runIds = Object.values(input.assignment).flat()
    if (runIds.length) await tx.select({ id: schema.runs.id }).from(schema.runs).where(inArray(schema.runs.id, runIds)).orderBy(asc(schema.runs.id)).for('update')
    const answer = await dayPlanAnswer(tx, input, policy)
    if (answer.problems.length) {
      invalidInput(answer.problems.map(p => ({ path: `assignment.${p.vesselId}.${Math.max(0, (input.assignment[p.vesselId] ?? []).indexOf(p.runId))}`, message: p.message })))
    }
    // A day with only the check a serviced vessel needs is a day plan; a day with nothing to fire is not.
    if (!answer.vessels.some(v => v.firings.length)) invalidInput([{ path: 'assignment', message: 'place at least one run on a vessel' }])
    const stored = { vessels: answer.vessels, leftovers: answer.leftovers, settings: answer.settings }
    const [plan] = await tx.insert(schema.dayPlans).values({ day: input.day, vesselIds: input.vesselIds, proposal: stored, acceptedBy: event.context.user!.id }).returning()
    for (const vd of answer.vessels) {
      const view = answer.views.get(vd.vesselId)!
      // The check or standardisation the vessel starts with becomes real runs the analyst fires first.
      await createDayPlanChecks(tx, event, { dayPlanId: plan!.id, day: input.day, vessel: view, slots: vd.firings.filter(f => !f.runId) }, policy)
      for (const f of vd.firings) {
        if (!runIds.includes(f.runId!)) continue
        const run = await findRunOr404(tx, f.runId!, true)
        const change: Partial<typeof schema.runs.$inferInsert> = { dayPlanId: plan!.id, dayOrder: f.order, updatedAt: new Date() }
        if (run.vesselId !== vd.vesselId) {
          const { assessment, chargeHash } = await assessRun(tx, { vessel: view, fillPressureMPa: run.fillPressureMPa, components: run.components, kind: run.kind }, policy)
          Object.assign(change, { vesselId: vd.vesselId, assessment, verdict: assessment.verdict, chargeHash, ...(run.status === 'draft' ? {} : { status: statusForVerdict(assessment.verdict) }) })
        }
        await tx.update(schema.runs).set(change).where(eq(schema.runs.id, run.id))
        await audit(tx, event, { action: 'run.schedule', entity: 'run', entityId: run.id, oldValues: { vesselId: run.vesselId, status: run.status }, newValues: { vesselId: vd.vesselId, dayPlanId: plan!.id, dayOrder: f.order, day: input.day, status: change.status ?? run.status } })
      }
    }
    await tx.update(schema.dayPlans).set({ proposal: stored }).where(eq(schema.dayPlans.id, plan!.id))
    await audit(tx, event, { action: 'day-plan.accept', entity: 'day-plan', entityId: plan!.id, newValues: { day: input.day, vesselIds: input.vesselIds, runs: runIds.length, checkRuns: answer.vessels.flatMap(v => v.firings).filter(f => !runIds.includes(f.runId!)).length, leftovers: answer.leftovers.length } })
    const { views: _views, ...rest } = answer
    return { id: plan!.id, ...rest }
  })
  setResponseStatus(event, 201)
  return result
})
