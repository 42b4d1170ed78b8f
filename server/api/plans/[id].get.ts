import { asc, count, eq, getTableColumns, inArray, sql } from 'drizzle-orm'
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
  const [runRows, [counts], [author], policy] = await Promise.all([
    db.select(assessment === 'summary' ? { ...getTableColumns(schema.runs), assessment: sql<AssessmentSummary>`${schema.runs.assessment}${withoutDetail}` } : getTableColumns(schema.runs))
      .from(schema.runs).where(eq(schema.runs.planId, id)).orderBy(asc(schema.runs.seq)).offset(runsOffset).limit(runsLimit),
    // Counts and the vessels used, over all runs of the plan (not only this page), in one pass.
    db.select({
      total: count(),
      drafts: sql<number>`count(*) filter (where ${schema.runs.status} = 'draft')`.mapWith(Number),
      vesselIds: sql<string[]>`array_agg(distinct ${schema.runs.vesselId})::text[]`,
    }).from(schema.runs).where(eq(schema.runs.planId, id)),
    db.select({ name: schema.users.name }).from(schema.users).where(eq(schema.users.id, plan.createdBy)),
    getPolicy(),
  ])
  const vesselIds = [...new Set([plan.vesselId, ...(counts?.vesselIds ?? []).filter(Boolean)])]
  const [sigs, vesselRows] = await Promise.all([
    signaturesFor(db, runRows.map(r => r.id)),
    db.select().from(schema.vessels).where(inArray(schema.vessels.id, vesselIds)).orderBy(asc(schema.vessels.name)),
  ])
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
