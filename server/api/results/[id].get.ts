import { asc, desc, eq } from 'drizzle-orm'

// One result with every revision of its run, its sample's duplicate agreement, the run and the certificates of the sample.
export default defineEventHandler(async (event) => {
  await requireRole(event, 'analyst', 'supervisor')
  const { id } = parseParams(event, resultIdParam)
  const db = useDb()
  const row = await findResultOr404(db, id)
  const policy = await getPolicy()
  const [revisionRows, run, reports] = await Promise.all([
    db.select().from(schema.results).where(eq(schema.results.runId, row.runId)).orderBy(asc(schema.results.revision)),
    findRunOr404(db, row.runId),
    db.select({ id: schema.reports.id, reportNumber: schema.reports.reportNumber, issuedAt: schema.reports.issuedAt, resultIds: schema.reports.resultIds })
      .from(schema.reports).where(eq(schema.reports.sampleCode, row.sampleCode)).orderBy(desc(schema.reports.issuedAt)),
  ])
  const revisions = await loadResultViews(db, revisionRows)
  const duplicates = row.kind === 'sample' ? await duplicateSummaries(db, [row.sampleCode], policy) : {}
  return {
    result: revisions.find(r => r.id === id)!,
    revisions,
    run: { id: run.id, planId: run.planId, seq: run.seq, sampleCode: run.sampleCode, kind: run.kind, components: run.components },
    duplicate: duplicates[row.sampleCode] ?? null,
    reports: reports.map(r => ({ id: r.id, reportNumber: r.reportNumber, issuedAt: r.issuedAt, resultIds: r.resultIds as string[] })),
  }
})
