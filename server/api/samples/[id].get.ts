import { and, asc, desc, eq, inArray, isNotNull } from 'drizzle-orm'

// One sample with its client, material, photos, the runs that test it (their day, firing and current result) and its certificates.
export default defineEventHandler(async (event) => {
  const user = await requireUser(event)
  const { id } = parseParams(event, idParam)
  const db = useDb()
  const sample = await findSampleOr404(db, id)
  const [client, material, runRows, photos, reports] = await Promise.all([
    findClientOr404(db, sample.clientId),
    sample.materialId ? db.select().from(schema.materials).where(eq(schema.materials.id, sample.materialId)).then(r => r[0] ?? null) : null,
    db.select({ run: schema.runs, vesselName: schema.vessels.name, planName: schema.plans.name, day: schema.dayPlans.day, outcome: schema.firings.outcome }).from(schema.runs)
      .innerJoin(schema.vessels, eq(schema.vessels.id, schema.runs.vesselId)).innerJoin(schema.plans, eq(schema.plans.id, schema.runs.planId))
      .leftJoin(schema.dayPlans, eq(schema.dayPlans.id, schema.runs.dayPlanId)).leftJoin(schema.firings, eq(schema.firings.runId, schema.runs.id))
      .where(eq(schema.runs.sampleId, id)).orderBy(asc(schema.runs.createdAt), asc(schema.runs.seq)),
    db.select().from(schema.attachments).where(and(eq(schema.attachments.sampleId, id), isNotNull(schema.attachments.sampleId))).orderBy(asc(schema.attachments.createdAt)),
    db.select({ id: schema.reports.id, reportNumber: schema.reports.reportNumber, issuedAt: schema.reports.issuedAt }).from(schema.reports).where(eq(schema.reports.sampleCode, sample.labCode)).orderBy(desc(schema.reports.issuedAt)),
  ])
  const runIds = runRows.map(r => r.run.id)
  const results = runIds.length
    ? await db.select({ id: schema.results.id, runId: schema.results.runId, status: schema.results.status, values: schema.results.values }).from(schema.results).where(and(inArray(schema.results.runId, runIds), eq(schema.results.current, true)))
    : []
  return {
    ...sampleView(sample, { clientName: client.name, materialName: material?.name ?? null, materialCategory: material?.category ?? null }),
    client: clientView(client),
    runs: runRows.map((r) => {
      const result = results.find(x => x.runId === r.run.id)
      return {
        id: r.run.id, planId: r.run.planId, planName: r.planName, seq: r.run.seq, status: r.run.status, verdict: r.run.verdict, vesselId: r.run.vesselId, vesselName: r.vesselName,
        dayPlanId: r.run.dayPlanId, day: r.day, dayOrder: r.run.dayOrder, outcome: r.outcome,
        result: result ? { id: result.id, status: result.status, grossJPerG: (result.values as { grossJPerG?: Record<string, number> }).grossJPerG?.['air-dried'] ?? null } : null,
      }
    }),
    photos: photos.map(attachmentView),
    // Certificates are read by the roles that may download them (the route list in shared/access.ts).
    reports: hasRole(user, 'analyst', 'supervisor') ? reports.map(r => ({ ...r, download: `/api/reports/${r.id}/certificate.pdf` })) : [],
  }
})
