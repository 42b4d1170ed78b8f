import { sql } from 'drizzle-orm'

// Public liveness/readiness probe for a reverse proxy: 200 when the database answers, 503 otherwise.
export default defineEventHandler(async () => {
  try {
    await useDb().execute(sql`select 1`)
    return { status: 'ok' }
  }
  catch {
    throw createError({ statusCode: 503, message: 'The database is not reachable.' })
  }
})
