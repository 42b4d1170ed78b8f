import { desc, eq, sql } from 'drizzle-orm'

// Plans with their run counts by status, newest first.
export default defineEventHandler(async (event) => {
  await requireRole(event)
  const db = useDb()
  const rows = await db.select({
    id: schema.plans.id,
    name: schema.plans.name,
    vesselId: schema.plans.vesselId,
    vesselName: schema.vessels.name,
    fillPressureMPa: schema.plans.fillPressureMPa,
    createdAt: schema.plans.createdAt,
    submittedAt: schema.plans.submittedAt,
    createdByName: schema.users.name,
    counts: sql<Record<string, number>>`coalesce((select jsonb_object_agg(status, n) from (select status, count(*)::int n from runs where runs.plan_id = ${schema.plans.id} group by status) s), '{}'::jsonb)`,
  }).from(schema.plans)
    .innerJoin(schema.vessels, eq(schema.vessels.id, schema.plans.vesselId))
    .innerJoin(schema.users, eq(schema.users.id, schema.plans.createdBy))
    .orderBy(desc(schema.plans.createdAt))
    .limit(200)
  return rows
})
