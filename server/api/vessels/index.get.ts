import { asc } from 'drizzle-orm'

// The register: every role reads it; the state of each vessel is computed now, by the one state function.
export default defineEventHandler(async (event) => {
  await requireUser(event)
  const [rows, policy] = await Promise.all([useDb().select().from(schema.vessels).orderBy(asc(schema.vessels.name)), getPolicy()])
  const now = new Date()
  return rows.map(v => vesselView(v, policy, now))
})
