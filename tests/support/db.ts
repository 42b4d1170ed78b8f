// Direct access to the test database, for checking what the API wrote (never for setting state the API owns).
import pg from 'pg'
import { afterAll } from 'vitest'

let pool: pg.Pool | undefined
export function testDb() {
  if (!pool) {
    pool = new pg.Pool({ connectionString: process.env.NUXT_DATABASE_URL, max: 4 })
    afterAll(async () => { await pool?.end(); pool = undefined })
  }
  return pool
}

export async function auditRows(filter: { action?: string, entityId?: string, since?: Date }) {
  const { rows } = await testDb().query(
    `select * from audit_log where ($1::text is null or action = $1) and ($2::text is null or entity_id = $2) and at >= coalesce($3::timestamptz, '-infinity') order by at`,
    [filter.action ?? null, filter.entityId ?? null, filter.since ?? null],
  )
  return rows
}
