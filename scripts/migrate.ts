// Applies the committed Drizzle migrations to NUXT_DATABASE_URL (run before the server starts).
import { drizzle } from 'drizzle-orm/node-postgres'
import { migrate } from 'drizzle-orm/node-postgres/migrator'
import pg from 'pg'

const url = process.env.NUXT_DATABASE_URL
if (!url) throw new Error('NUXT_DATABASE_URL is not set')
const pool = new pg.Pool({ connectionString: url, max: 1 })
await migrate(drizzle(pool), { migrationsFolder: new URL('../server/database/migrations', import.meta.url).pathname })
await pool.end()
console.log('migrations applied')
