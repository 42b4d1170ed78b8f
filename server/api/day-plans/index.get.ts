import { desc, gte } from 'drizzle-orm'
import { z } from 'zod'

const query = z.object({ from: z.iso.date('a day (YYYY-MM-DD)').optional() })

// Accepted day plans from a day on (default today), newest day first: what each vessel is promised to fire.
export default defineEventHandler(async (event) => {
  await requireUser(event)
  const { from } = parseQuery(event, query)
  const rows = await useDb().select().from(schema.dayPlans).where(gte(schema.dayPlans.day, from ?? new Date().toISOString().slice(0, 10))).orderBy(desc(schema.dayPlans.day), desc(schema.dayPlans.acceptedAt)).limit(100)
  return rows.map(r => ({ id: r.id, day: r.day, vesselIds: r.vesselIds, proposal: r.proposal, acceptedBy: r.acceptedBy, acceptedAt: r.acceptedAt }))
})
