import { and, asc, eq, isNotNull } from 'drizzle-orm'

// One sample with its client, material, photos and the runs that test it.
export default defineEventHandler(async (event) => {
  await requireUser(event)
  const { id } = parseParams(event, idParam)
  const db = useDb()
  const sample = await findSampleOr404(db, id)
  const [client, material, runRows, photos] = await Promise.all([
    findClientOr404(db, sample.clientId),
    sample.materialId ? db.select().from(schema.materials).where(eq(schema.materials.id, sample.materialId)).then(r => r[0] ?? null) : null,
    db.select({ run: schema.runs, vesselName: schema.vessels.name, planName: schema.plans.name }).from(schema.runs)
      .innerJoin(schema.vessels, eq(schema.vessels.id, schema.runs.vesselId)).innerJoin(schema.plans, eq(schema.plans.id, schema.runs.planId))
      .where(eq(schema.runs.sampleId, id)).orderBy(asc(schema.runs.createdAt), asc(schema.runs.seq)),
    db.select().from(schema.attachments).where(and(eq(schema.attachments.sampleId, id), isNotNull(schema.attachments.sampleId))).orderBy(asc(schema.attachments.createdAt)),
  ])
  return {
    ...sampleView(sample, { clientName: client.name, materialName: material?.name ?? null, materialCategory: material?.category ?? null }),
    client: clientView(client),
    runs: runRows.map(r => ({ id: r.run.id, planId: r.run.planId, planName: r.planName, seq: r.run.seq, status: r.run.status, verdict: r.run.verdict, vesselId: r.run.vesselId, vesselName: r.vesselName, dayPlanId: r.run.dayPlanId, dayOrder: r.run.dayOrder })),
    photos: photos.map(attachmentView),
  }
})
