import { asc, eq, inArray, max } from 'drizzle-orm'
import { z } from 'zod'

const body = z.object({
  sampleIds: z.array(z.string().uuid('a sample id (UUID)')).min(1, 'choose at least one sample').max(200, 'at most 200 samples at once')
    .refine(ids => new Set(ids).size === ids.length, 'a sample is named twice'),
  determinations: z.number().int().min(1).max(10).optional(),
  vesselId: z.string().uuid('a vessel id (UUID)').optional(),
  fillPressureMPa: z.number().positive('above 0').max(20).optional(),
}).strict()

// Plans waiting samples into a plan: one run per determination (duplicates by default, lab policy) for each sample,
// each run carrying the sample, its material and the suggested mass; the samples become "planned" in the same transaction.
export default defineEventHandler(async (event) => {
  const user = await requireRole(event)
  const { id } = parseParams(event, idParam)
  const input = await parseBody(event, body)
  const policy = await getPolicy()
  const determinations = input.determinations ?? policy.determinationsPerSample
  const created = await useDb().transaction(async (tx) => {
    const plan = await findPlanOr404(tx, id, true)
    if (plan.submittedAt) throw createError({ statusCode: 409, message: 'This plan has been submitted; plan the samples into a new plan.' })
    const vesselId = input.vesselId ?? plan.vesselId
    const vessel = vesselView(await findVesselOr404(tx, vesselId), policy)
    const fillPressureMPa = input.fillPressureMPa ?? plan.fillPressureMPa
    const rows = await tx.select().from(schema.samples).where(inArray(schema.samples.id, input.sampleIds)).orderBy(asc(schema.samples.id)).for('update')
    const byId = new Map(rows.map(r => [r.id, r]))
    const issues = input.sampleIds.flatMap((sid, i) => {
      const s = byId.get(sid)
      if (!s) return [{ path: `sampleIds.${i}`, message: 'no such sample' }]
      if (s.status !== 'received') return [{ path: `sampleIds.${i}`, message: `${s.labCode} is ${s.status}, not waiting in the queue` }]
      return []
    })
    if (issues.length) invalidInput(issues)
    const [last] = await tx.select({ seq: max(schema.runs.seq) }).from(schema.runs).where(eq(schema.runs.planId, id))
    let seq = last?.seq ?? 0
    const out: RunRow[] = []
    for (const sid of input.sampleIds) {
      const sample = byId.get(sid)!
      const { components, assessment, chargeHash } = await suggestedRun(tx, sample, vessel, fillPressureMPa, policy)
      for (let d = 0; d < determinations; d++) {
        const [row] = await tx.insert(schema.runs).values({
          planId: id, seq: ++seq, sampleCode: sample.labCode, kind: 'sample', vesselId, fillPressureMPa, components, assessment,
          verdict: assessment.verdict, chargeHash, status: 'draft', note: `determination ${d + 1} of ${determinations}`, plannedBy: user.id, sampleId: sample.id,
        }).returning()
        await audit(tx, event, { action: 'run.create', entity: 'run', entityId: row!.id, newValues: { ...row!, assessment: undefined, verdict: assessment.verdict } })
        out.push(row!)
      }
      await tx.update(schema.samples).set({ status: 'planned', determinations, updatedAt: new Date() }).where(eq(schema.samples.id, sid))
      await audit(tx, event, { action: 'sample.plan', entity: 'sample', entityId: sid, oldValues: { status: 'received' }, newValues: { status: 'planned', planId: id, runs: determinations } })
    }
    return out
  })
  setResponseStatus(event, 201)
  return { planId: id, determinations, runs: created.map(r => runView(r)) }
})
