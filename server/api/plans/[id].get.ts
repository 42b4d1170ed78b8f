import { asc, count, eq, getTableColumns, sql } from 'drizzle-orm'
import { ASSESSMENT_DETAIL_KEYS } from '#shared/domain/assessment'
import type { AssessmentSummary } from '#shared/domain/assessment'
import { z } from 'zod'

// A page of runs: the plan page asks for 100 at a time; without a query the answer holds the first 1000 runs.
export const PLAN_RUNS_MAX_PAGE = 1000
const query = z.object({
  runsOffset: z.coerce.number().int().min(0).max(1_000_000).default(0),
  runsLimit: z.coerce.number().int().min(1).max(PLAN_RUNS_MAX_PAGE).default(PLAN_RUNS_MAX_PAGE),
  // 'summary': each run's assessment without its per-component figures, suggestions and method notes (what the plan
  // page shows; about a quarter of the size). The run's own page has the whole assessment.
  assessment: z.enum(['full', 'summary']).default('full'),
})
const withoutDetail = sql.raw(ASSESSMENT_DETAIL_KEYS.map(k => ` - '${k}'`).join(''))

// A plan with its runs in order (one page of them), each with its stored assessment (or its summary) and signatures, and the vessels it uses.
export default defineEventHandler(async (event) => {
  await requireRole(event)
  const { id } = parseParams(event, idParam)
  const { runsOffset, runsLimit, assessment } = parseQuery(event, query)
  const db = useDb()
  const plan = await findPlanOr404(db, id)
  const [runRows, [counts], vesselIdRows, [author], policy] = await Promise.all([
    db.select(assessment === 'summary' ? { ...getTableColumns(schema.runs), assessment: sql<AssessmentSummary>`${schema.runs.assessment}${withoutDetail}` } : getTableColumns(schema.runs))
      .from(schema.runs).where(eq(schema.runs.planId, id)).orderBy(asc(schema.runs.seq)).offset(runsOffset).limit(runsLimit),
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
