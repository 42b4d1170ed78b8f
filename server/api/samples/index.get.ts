import { and, asc, count, desc, eq, ilike, or } from 'drizzle-orm'
import type { SQL } from 'drizzle-orm'
import { z } from 'zod'
import { MATERIAL_CATEGORIES } from '#shared/schemas/materials'
import { SAMPLE_STATUSES } from '#shared/schemas/samples'

const query = z.object({
  status: z.enum(SAMPLE_STATUSES).optional(),
  clientId: z.string().uuid('a client id (UUID)').optional(),
  category: z.enum(MATERIAL_CATEGORIES).optional(),
  q: z.string().trim().max(100).optional(),
  page: z.coerce.number().int().min(1).max(100_000).default(1),
  pageSize: z.coerce.number().int().min(1).max(500).default(100),
})

// The register of received samples; ?status=received is the queue the analyst plans from (oldest first).
export default defineEventHandler(async (event) => {
  await requireUser(event)
  const { status, clientId, category, q, page, pageSize } = parseQuery(event, query)
  const s = schema.samples
  const where: SQL[] = []
  if (status) where.push(eq(s.status, status))
  if (clientId) where.push(eq(s.clientId, clientId))
  if (category) where.push(eq(schema.materials.category, category))
  if (q) {
    const like = `%${q.replace(/[%_\\]/g, m => `\\${m}`)}%`
    where.push(or(ilike(s.labCode, like), ilike(s.clientReference, like), ilike(s.description, like), ilike(schema.clients.name, like))!)
  }
  const db = useDb()
  const base = () => db.select({ sample: s, clientName: schema.clients.name, materialName: schema.materials.name, materialCategory: schema.materials.category })
    .from(s).innerJoin(schema.clients, eq(schema.clients.id, s.clientId)).leftJoin(schema.materials, eq(schema.materials.id, s.materialId))
  // The queue waits oldest first; the register shows the newest first.
  const order = status === 'received' ? [asc(s.receivedAt), asc(s.labCode)] : [desc(s.receivedAt), desc(s.labCode)]
  const [rows, [total]] = await Promise.all([
    base().where(and(...where)).orderBy(...order).limit(pageSize).offset((page - 1) * pageSize),
    db.select({ n: count() }).from(s).innerJoin(schema.clients, eq(schema.clients.id, s.clientId)).leftJoin(schema.materials, eq(schema.materials.id, s.materialId)).where(and(...where)),
  ])
  const now = new Date()
  return { rows: rows.map(r => sampleView(r.sample, r, now)), total: total?.n ?? 0, page, pageSize }
})
