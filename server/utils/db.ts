import { drizzle } from 'drizzle-orm/node-postgres'
import type { NodePgDatabase } from 'drizzle-orm/node-postgres'
import pg from 'pg'
import * as schema from '../database/schema'

export type Db = NodePgDatabase<typeof schema>
export type Tx = Parameters<Parameters<Db['transaction']>[0]>[0]

let pool: pg.Pool | undefined
let db: Db | undefined

/** The one pooled database client of this process (no request state is kept here). */
export function useDb(): Db {
  if (!db) {
    const url = databaseUrl()
    pool = new pg.Pool({ connectionString: url, max: Number(process.env.EMBERLINE_DB_POOL ?? 10), connectionTimeoutMillis: 5_000 })
    // An idle client that loses its connection must not crash the process; the pool replaces it.
    pool.on('error', err => console.error('[db] idle client error:', err.message))
    db = drizzle(pool, { schema })
  }
  return db
}

/** The database this process uses (runtime config, or NUXT_DATABASE_URL). */
export function databaseUrl(): string {
  const url = useRuntimeConfig().databaseUrl || process.env.NUXT_DATABASE_URL
  if (!url) throw createError({ statusCode: 503, message: 'The database is not configured (NUXT_DATABASE_URL).' })
  return url
}

export { schema }
