import { eq, sql } from 'drizzle-orm'
import { z } from 'zod'

const query = z.object({ q: z.string().trim().min(1, 'type or scan a code').max(120) })

// The header's search box: a lab code (typed by hand or by a bench scanner) opens its sample; a plan or vessel name opens it.
export default defineEventHandler(async (event) => {
  await requireUser(event)
  const { q } = parseQuery(event, query)
  const code = q.toUpperCase().replace(/\s+/g, '')
  const db = useDb()
  const [sample] = await db.select({ id: schema.samples.id, labCode: schema.samples.labCode }).from(schema.samples).where(eq(schema.samples.labCode, code))
  if (sample) return { kind: 'sample', id: sample.id, label: sample.labCode, to: `/samples/${sample.id}` }
  const [vessel] = await db.select({ id: schema.vessels.id, name: schema.vessels.name }).from(schema.vessels)
    .where(sql`upper(${schema.vessels.name}) = ${code} or upper(${schema.vessels.serialNumber}) = ${code}`)
  if (vessel) return { kind: 'vessel', id: vessel.id, label: vessel.name, to: `/vessels/${vessel.id}` }
  throw createError({ statusCode: 404, message: `Nothing has the code ${q}.` })
})
