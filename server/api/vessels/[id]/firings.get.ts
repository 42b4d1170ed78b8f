import { desc, eq } from 'drizzle-orm'
import { z } from 'zod'

const query = z.object({
  page: z.coerce.number().int('a whole number').min(1, 'at least 1').max(100_000).default(1),
  pageSize: z.coerce.number().int('a whole number').min(1, 'at least 1').max(100, 'at most 100').default(25),
})

// A vessel's firings, newest first, a page at a time, and its firings per week over the last 26 weeks.
// Totals come from the counters on the vessel row: the firings themselves are never counted whole.
export default defineEventHandler(async (event) => {
  await requireUser(event)
  const { id } = parseParams(event, vesselIdParam)
  const { page, pageSize } = parseQuery(event, query)
  const db = useDb()
  const vessel = await findVesselOr404(db, id)
  const f = schema.firings
  const [rows, weekly] = await Promise.all([
    db.select({
      id: f.id, runId: f.runId, outcome: f.outcome, weighedMassG: f.weighedMassG, firedAt: f.firedAt,
      sampleCode: schema.runs.sampleCode, kind: schema.runs.kind, planId: schema.runs.planId, firedByName: schema.users.name,
    }).from(f)
      .leftJoin(schema.runs, eq(schema.runs.id, f.runId))
      .leftJoin(schema.users, eq(schema.users.id, f.firedBy))
      .where(eq(f.vesselId, id))
      .orderBy(desc(f.firedAt), desc(f.id))
      .limit(pageSize + 1)
      .offset((page - 1) * pageSize),
    weeklyFirings(db, id),
  ])
  return {
    rows: rows.slice(0, pageSize),
    page,
    pageSize,
    hasMore: rows.length > pageSize,
    // Firings recorded in Emberline (lifetime counter minus the count the vessel was registered with).
    recordedTotal: vessel.firingsTotal - vessel.firingsTotalAtRegistration,
    firingsTotal: vessel.firingsTotal,
    weekly,
  }
})
