import { asc } from 'drizzle-orm'

// Everyone signed in reads the clients register (the receipt form and certificates need it).
export default defineEventHandler(async (event) => {
  await requireUser(event)
  const rows = await useDb().select().from(schema.clients).orderBy(asc(schema.clients.name))
  return rows.map(clientView)
})
