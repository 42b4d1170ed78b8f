// Adds the demo lab's clients and a queue of received samples to NUXT_DATABASE_URL, so the day plan can be tried at once.
// Run after scripts/seed.ts. Idempotent: a client is added once, a sample once per client reference.
import { eq, sql } from 'drizzle-orm'
import { drizzle } from 'drizzle-orm/node-postgres'
import pg from 'pg'
import * as schema from '../server/database/schema'
import { formatLabCode, labCodePrefix } from '../shared/schemas/samples'
import { DEMO_CLIENTS, DEMO_RECEIPTS } from '../data/demo-receipt'
import { DEMO_LAB_NAME } from '../data/demo-lab'

const url = process.env.NUXT_DATABASE_URL
if (!url) throw new Error('NUXT_DATABASE_URL is not set')
const pool = new pg.Pool({ connectionString: url, max: 2 })
const db = drizzle(pool, { schema })
const HOUR = 3_600_000

let added = 0
await db.transaction(async (tx) => {
  const [settings] = await tx.select().from(schema.labSettings).where(eq(schema.labSettings.id, 1))
  const [supervisor] = await tx.select().from(schema.users).where(eq(schema.users.email, 'supervisor@emberline.test'))
  const [analyst] = await tx.select().from(schema.users).where(eq(schema.users.email, 'analyst@emberline.test'))
  if (!supervisor || !analyst) throw new Error('load the demo lab first (scripts/seed.ts)')
  const prefix = labCodePrefix(settings?.labName ?? DEMO_LAB_NAME)
  const clientIds = new Map<string, string>()
  for (const c of DEMO_CLIENTS) {
    const [row] = await tx.insert(schema.clients).values({ ...c, createdBy: supervisor.id }).onConflictDoNothing({ target: schema.clients.name }).returning()
    if (row) await tx.insert(schema.auditLog).values({ actorId: supervisor.id, actorName: supervisor.name, action: 'client.create', entity: 'client', entityId: row.id, newValues: row, reason: 'demo lab loaded' })
    const [found] = await tx.select().from(schema.clients).where(eq(schema.clients.name, c.name))
    clientIds.set(c.name, found!.id)
  }
  const materials = await tx.select({ id: schema.materials.id, name: schema.materials.name }).from(schema.materials)
  const known = new Set((await tx.select({ k: sql<string>`${schema.samples.clientId} || '|' || ${schema.samples.clientReference}` }).from(schema.samples)).map(r => r.k))
  // Oldest first, so that lab codes follow the order of receipt.
  for (const r of [...DEMO_RECEIPTS].sort((a, b) => b.hoursAgo - a.hoursAgo)) {
    const clientId = clientIds.get(r.client)!
    if (known.has(`${clientId}|${r.reference}`)) continue
    const receivedAt = new Date(Math.floor((Date.now() - r.hoursAgo * HOUR) / 60_000) * 60_000)
    const { rows } = await tx.execute<{ n: string }>(sql`select nextval('sample_lab_code_seq') as n`)
    const materialId = r.material ? materials.find(m => m.name === r.material)?.id ?? null : null
    const [row] = await tx.insert(schema.samples).values({
      labCode: formatLabCode(prefix, receivedAt.getUTCFullYear(), Number(rows[0]!.n)), clientId, clientReference: r.reference, description: r.description,
      materialId, receivedAt, condition: r.condition, receivedMassG: r.massG, status: 'received', receivedBy: analyst.id,
    }).returning()
    await tx.insert(schema.auditLog).values({ actorId: analyst.id, actorName: analyst.name, action: 'sample.receive', entity: 'sample', entityId: row!.id, newValues: row!, reason: 'demo lab loaded' })
    added++
  }
})
await pool.end()
console.log(`demo clients and sample queue ready (${added} samples added)`)
