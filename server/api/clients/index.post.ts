import { eq, sql } from 'drizzle-orm'
import { clientCreateSchema } from '#shared/schemas/samples'

// Supervisors and admins keep the clients register; a name is registered once (case and spacing ignored).
export default defineEventHandler(async (event) => {
  const user = await requireRole(event)
  const input = await parseBody(event, clientCreateSchema)
  const row = await useDb().transaction(async (tx) => {
    const [same] = await tx.select({ id: schema.clients.id }).from(schema.clients)
      .where(eq(sql`lower(regexp_replace(${schema.clients.name}, '\\s+', ' ', 'g'))`, input.name.toLowerCase().replace(/\s+/g, ' ')))
    if (same) throw createError({ statusCode: 409, message: `A client named ${input.name} is already registered.`, data: { fields: [{ path: 'name', message: 'already registered' }] } })
    const [created] = await tx.insert(schema.clients).values({ ...input, createdBy: user.id }).returning()
    await audit(tx, event, { action: 'client.create', entity: 'client', entityId: created!.id, newValues: created })
    return created!
  })
  setResponseStatus(event, 201)
  return clientView(row)
})
