import { asc } from 'drizzle-orm'

export default defineEventHandler(async (event) => {
  await requireRole(event)
  const rows = await useDb().select().from(schema.users).orderBy(asc(schema.users.name))
  return rows.map(publicUser)
})
