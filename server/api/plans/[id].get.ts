import { asc, eq } from 'drizzle-orm'

// A plan with its runs in order, each with its stored assessment and signatures, and the vessels it uses.
export default defineEventHandler(async (event) => {
  await requireRole(event, 'analyst', 'supervisor')
  const { id } = parseParams(event, idParam)
  const db = useDb()
  const plan = await findPlanOr404(db, id)
  const [runRows, [author], policy] = await Promise.all([
    db.select().from(schema.runs).where(eq(schema.runs.planId, id)).orderBy(asc(schema.runs.seq)),
    db.select({ name: schema.users.name }).from(schema.users).where(eq(schema.users.id, plan.createdBy)),
    getPolicy(),
  ])
  const sigs = await signaturesFor(db, runRows.map(r => r.id))
  const vesselIds = [...new Set([plan.vesselId, ...runRows.map(r => r.vesselId)])]
  const vesselRows = await Promise.all(vesselIds.map(v => findVesselOr404(db, v)))
  return {
    ...plan,
    createdByName: author?.name ?? '',
    runs: runRows.map(r => runView(r, sigs.get(r.id))),
    vessels: vesselRows.map(v => vesselView(v, policy)),
  }
})
