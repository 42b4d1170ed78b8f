import { asc, count, eq, sql } from 'drizzle-orm'
import { z } from 'zod'

// A page of runs: the plan page asks for 100 at a time; without a query the answer holds the first 1000 runs.
export const PLAN_RUNS_MAX_PAGE = 1000
const query = z.object({
  runsOffset: z.coerce.number().int().min(0).max(1_000_000).default(0),
  runsLimit: z.coerce.number().int().min(1).max(PLAN_RUNS_MAX_PAGE).default(PLAN_RUNS_MAX_PAGE),
})

// A plan with its runs in order (one page of them), each with its stored assessment and signatures, and the vessels it uses.
export default defineEventHandler(async (event) => {
  await requireRole(event)
  const { id } = parseParams(event, idParam)
  const { runsOffset, runsLimit } = parseQuery(event, query)
  const db = useDb()
  const plan = await findPlanOr404(db, id)
  const [runRows, [counts], vesselIdRows, [author], policy] = await Promise.all([
    db.select().from(schema.runs).where(eq(schema.runs.planId, id)).orderBy(asc(schema.runs.seq)).offset(runsOffset).limit(runsLimit),
    db.select({ total: count(), drafts: sql<number>`count(*) filter (where ${schema.runs.status} = 'draft')`.mapWith(Number) }).from(schema.runs).where(eq(schema.runs.planId, id)),
    db.selectDistinct({ vesselId: schema.runs.vesselId }).from(schema.runs).where(eq(schema.runs.planId, id)),
    db.select({ name: schema.users.name }).from(schema.users).where(eq(schema.users.id, plan.createdBy)),
    getPolicy(),
  ])
  const sigs = await signaturesFor(db, runRows.map(r => r.id))
  const vesselIds = [...new Set([plan.vesselId, ...vesselIdRows.map(r => r.vesselId)])]
  const vesselRows = await Promise.all(vesselIds.map(v => findVesselOr404(db, v)))
  return {
    ...plan,
    createdByName: author?.name ?? '',
    runs: runRows.map(r => runView(r, sigs.get(r.id))),
    runsTotal: counts?.total ?? 0,
    runsOffset,
    draftCount: counts?.drafts ?? 0,
    vessels: vesselRows.map(v => vesselView(v, policy)),
  }
})
