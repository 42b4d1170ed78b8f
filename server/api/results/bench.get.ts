import { and, asc, desc, eq, gte, inArray } from 'drizzle-orm'


const DAY_MS = 86_400_000
/** Fired runs stay on the bench this long (or until their result is in). */
const FIRED_WINDOW_DAYS = 30

// The analyst's bench: every vessel with its state and accepted ε, the runs waiting to be fired and the recent firings with their results.
export default defineEventHandler(async (event) => {
  await requireRole(event)
  const db = useDb()
  const policy = await getPolicy()
  const now = new Date()
  const r = schema.runs
  const [vesselRows, energies, waiting, firedRows] = await Promise.all([
    db.select().from(schema.vessels).orderBy(asc(schema.vessels.name)),
    db.select().from(schema.energyEquivalents).where(eq(schema.energyEquivalents.active, true)),
    db.select({ run: r, planName: schema.plans.name }).from(r).innerJoin(schema.plans, eq(schema.plans.id, r.planId))
      .where(inArray(r.status, ['ready', 'awaiting-approval', 'blocked'])).orderBy(asc(schema.plans.createdAt), asc(r.seq)).limit(500),
    db.select({ run: r, planName: schema.plans.name, firing: schema.firings, firedByName: schema.users.name }).from(schema.firings)
      .innerJoin(r, eq(r.id, schema.firings.runId)).innerJoin(schema.plans, eq(schema.plans.id, r.planId)).innerJoin(schema.users, eq(schema.users.id, schema.firings.firedBy))
      .where(gte(schema.firings.firedAt, new Date(now.getTime() - FIRED_WINDOW_DAYS * DAY_MS))).orderBy(desc(schema.firings.firedAt)).limit(300),
  ])
  const resultRows = firedRows.length
    ? await db.select().from(schema.results).where(and(inArray(schema.results.runId, firedRows.map(f => f.run.id)), eq(schema.results.current, true)))
    : []
  const materialIds = [...new Set([...waiting.map(w => w.run), ...firedRows.map(f => f.run)].flatMap(x => x.components.flatMap(c => (c.materialId ? [c.materialId] : []))))]
  const materialNames = new Map((materialIds.length ? await db.select({ id: schema.materials.id, name: schema.materials.name }).from(schema.materials).where(inArray(schema.materials.id, materialIds)) : []).map(m => [m.id, m.name]))
  const sigs = await signaturesFor(db, waiting.map(w => w.run.id))
  const duplicates = await duplicateSummaries(db, resultRows.filter(x => x.kind === 'sample').map(x => x.sampleCode), policy)
  const byRun = new Map((await loadResultViews(db, resultRows)).map(v => [v.runId, v]))

  const describe = (run: typeof r.$inferSelect) => {
    const cs = run.components
    const sample = cs.find(c => c.role === 'sample')
    const aid = cs.find(c => c.role === 'aid')
    const fuse = cs.find(c => c.role === 'fuse')
    return {
      sampleName: (sample?.materialId && materialNames.get(sample.materialId)) || sample?.name || null,
      plannedSampleMassG: cs.filter(c => c.role === 'sample').reduce((a, c) => a + (c.massG ?? 0), 0),
      aid: aid ? { name: (aid.materialId && materialNames.get(aid.materialId)) || aid.name || 'combustion aid', massG: aid.massG ?? 0 } : null,
      fuse: fuse ? { wire: fuse.wire ?? 'nichrome', lengthCm: fuse.lengthCm ?? null, massG: fuse.massG ?? null } : null,
    }
  }
  return {
    vessels: vesselRows.filter(v => v.condition !== 'retired').map((v) => {
      const e = energies.find(x => x.vesselId === v.id)
      return { ...vesselView(v, policy, now), energyEquivalent: e ? { id: e.id, valueJPerK: e.valueJPerK, relativeStandardDeviationPct: e.relativeStandardDeviationPct, runs: e.runs, acceptedAt: e.acceptedAt } : null }
    }),
    queue: waiting.map(({ run, planName }) => {
      const view = runView(run, sigs.get(run.id))
      return {
        id: run.id, planId: run.planId, planName, seq: run.seq, sampleCode: run.sampleCode, kind: run.kind, vesselId: run.vesselId, fillPressureMPa: run.fillPressureMPa,
        status: view.status, verdict: view.verdict, signatures: view.signatures,
        topFinding: view.assessment.findings.find(f => f.severity === 'block') ?? view.assessment.findings.find(f => f.severity === 'approval') ?? null,
        heatReleaseJ: view.assessment.heatReleaseJ,
        ...describe(run),
      }
    }),
    fired: firedRows.map(({ run, planName, firing, firedByName }) => ({
      id: run.id, planId: run.planId, planName, seq: run.seq, sampleCode: run.sampleCode, kind: run.kind, vesselId: run.vesselId,
      ...describe(run),
      firing: { id: firing.id, outcome: firing.outcome, weighedMassG: firing.weighedMassG, aidMassG: firing.data.aidMassG ?? null, observations: firing.data.observations ?? '', firedAt: firing.firedAt, firedByName },
      result: byRun.get(run.id) ?? null,
    })),
    duplicates,
  }
})
