import { and, asc, eq, inArray } from 'drizzle-orm'
import { RUN_TRANSITIONS, withHandler } from '#shared/domain/run-lifecycle'


// Submitting re-assesses every draft run against its vessel as it stands now and routes it by verdict:
// clear → ready, needs approval → awaiting a supervisor's signature, blocked → only edit or withdraw.
export default defineEventHandler(async (event) => {
  const user = await requireRole(event)
  const { id } = parseParams(event, idParam)
  const policy = await getPolicy()
  const result = await useDb().transaction(async (tx) => {
    const plan = await findPlanOr404(tx, id, true)
    const drafts = await tx.select().from(schema.runs).where(and(eq(schema.runs.planId, id), inArray(schema.runs.status, [...RUN_TRANSITIONS.submit.from]))).orderBy(asc(schema.runs.seq)).for('update')
    if (!drafts.length) throw createError({ statusCode: 409, message: 'There is no draft run in this plan to submit.' })
    const missingMass = drafts.filter(r => !r.components.some(c => c.role === 'sample' && (c.massG ?? 0) > 0))
    if (missingMass.length) {
      invalidInput(missingMass.map(r => ({ path: `runs.${r.seq}.massG`, message: `run ${r.seq} (${r.sampleCode}) needs a planned sample mass` })))
    }
    const now = new Date()
    const moved: { id: string, seq: number, sampleCode: string, status: string }[] = []
    for (const r of drafts) {
      const vessel = vesselView(await findVesselOr404(tx, r.vesselId), policy, now)
      const { assessment, chargeHash } = await assessRun(tx, { vessel, fillPressureMPa: r.fillPressureMPa, components: r.components, kind: r.kind }, policy)
      const status = statusForVerdict(assessment.verdict)
      await tx.update(schema.runs).set({ assessment, verdict: assessment.verdict, chargeHash, status, statusReason: null, submittedBy: withHandler(r.submittedBy, user.id), updatedAt: now }).where(eq(schema.runs.id, r.id))
      await audit(tx, event, { action: 'run.submit', entity: 'run', entityId: r.id, oldValues: { status: 'draft' }, newValues: { status, verdict: assessment.verdict, findings: assessment.findings.map(f => f.code) } })
      moved.push({ id: r.id, seq: r.seq, sampleCode: r.sampleCode, status })
    }
    await tx.update(schema.plans).set({ submittedAt: now, updatedAt: now }).where(eq(schema.plans.id, id))
    const counts = moved.reduce<Record<string, number>>((acc, r) => ({ ...acc, [r.status]: (acc[r.status] ?? 0) + 1 }), {})
    await audit(tx, event, { action: 'plan.submit', entity: 'plan', entityId: id, newValues: counts })
    const waiting = moved.filter(r => r.status === 'awaiting-approval')
    if (waiting.length) {
      // One message per submitted plan, not per run.
      const to = await recipientsWithRole(tx, 'supervisor')
      if (to.length) {
        await enqueueMail(tx, {
          to,
          ...planSubmittedMail({ by: user.name, planName: plan.name, waiting, counts }),
          dedupeKey: `plan-submit:${id}:${now.toISOString()}`,
        })
      }
    }
    return { counts, runs: moved }
  })
  return result
})
