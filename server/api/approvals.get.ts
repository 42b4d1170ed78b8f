import { asc, eq } from 'drizzle-orm'
import { runDutyConflict } from '#shared/domain/run-lifecycle'

// The approvals queue: each waiting run with its findings, the numbers behind them, the analyst's note and, for a
// run sent back at the firing, why it needs a new signature.
export default defineEventHandler(async (event) => {
  const user = await requireRole(event)
  const db = useDb()
  const rows = await db.select({ run: schema.runs, planName: schema.plans.name, plannerName: schema.users.name, vesselName: schema.vessels.name, vesselClass: schema.vessels.class })
    .from(schema.runs)
    .innerJoin(schema.plans, eq(schema.plans.id, schema.runs.planId))
    .innerJoin(schema.users, eq(schema.users.id, schema.runs.plannedBy))
    .innerJoin(schema.vessels, eq(schema.vessels.id, schema.runs.vesselId))
    .where(eq(schema.runs.status, 'awaiting-approval'))
    .orderBy(asc(schema.runs.updatedAt))
    .limit(500)
  return rows.map(r => ({
    ...runView(r.run),
    planName: r.planName,
    plannerName: r.plannerName,
    vesselName: r.vesselName,
    vesselClass: r.vesselClass,
    // The signer's own part in the run (planned, edited, submitted): they may not sign it.
    dutyConflict: runDutyConflict(r.run, user.id),
    ownRun: runDutyConflict(r.run, user.id) !== null,
  }))
})
