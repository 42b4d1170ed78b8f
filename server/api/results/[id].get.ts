import { asc, desc, eq } from 'drizzle-orm'


// One result with every revision of its run, the firing, its sample's duplicate agreement and the sample's certificates.
export default defineEventHandler(async (event) => {
  await requireRole(event)
  const { id } = parseParams(event, resultIdParam)
  const db = useDb()
  const row = await findResultOr404(db, id)
  const policy = await getPolicy()
  const [revisionRows, run, [firing], reports] = await Promise.all([
    db.select().from(schema.results).where(eq(schema.results.runId, row.runId)).orderBy(asc(schema.results.revision)),
    findRunOr404(db, row.runId),
    db.select({ f: schema.firings, firedByName: schema.users.name }).from(schema.firings).innerJoin(schema.users, eq(schema.users.id, schema.firings.firedBy)).where(eq(schema.firings.id, row.firingId)),
    db.select({ id: schema.reports.id, reportNumber: schema.reports.reportNumber, issuedAt: schema.reports.issuedAt, resultIds: schema.reports.resultIds })
      .from(schema.reports).where(eq(schema.reports.sampleCode, row.sampleCode)).orderBy(desc(schema.reports.issuedAt)),
  ])
  const revisions = await loadResultViews(db, revisionRows)
  const duplicates = row.kind === 'sample' ? await duplicateSummaries(db, [row.sampleCode], policy) : {}
  const components = run.components
  const aid = components.find(c => c.role === 'aid')
  const fuse = components.find(c => c.role === 'fuse')
  const data = (firing?.f.data ?? {}) as { aidMassG?: number | null, observations?: string }
  return {
    result: revisions.find(r => r.id === id)!,
    revisions,
    run: {
      id: run.id, planId: run.planId, seq: run.seq, sampleCode: run.sampleCode, sampleId: run.sampleId, kind: run.kind, vesselId: run.vesselId, components,
      plannedSampleMassG: components.filter(c => c.role === 'sample').reduce((a, c) => a + (c.massG ?? 0), 0),
      aid: aid ? { name: aid.name ?? 'combustion aid', massG: aid.massG ?? 0 } : null,
      fuse: fuse ? { wire: fuse.wire ?? 'nichrome', lengthCm: fuse.lengthCm ?? null, massG: fuse.massG ?? null } : null,
    },
    firing: firing
      ? { id: firing.f.id, outcome: firing.f.outcome, weighedMassG: firing.f.weighedMassG, aidMassG: data.aidMassG ?? null, observations: data.observations ?? '', firedAt: firing.f.firedAt, firedByName: firing.firedByName }
      : null,
    duplicate: duplicates[row.sampleCode] ?? null,
    reports: reports.map(r => ({ id: r.id, reportNumber: r.reportNumber, issuedAt: r.issuedAt, resultIds: r.resultIds })),
  }
})
