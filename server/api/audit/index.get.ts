import { sql } from 'drizzle-orm'

// Counting every match of a broad search over a large trail is what costs; beyond this many the answer says "more than".
const COUNT_CAP = 10_000

// The audit trail, newest first, for those who answer for the lab's records. Read-only: no route changes it.
export default defineEventHandler(async (event) => {
  await requireRole(event)
  const q = parseQuery(event, auditFilterSchema.and(auditPageSchema))
  const where = auditWhere(q)
  const db = useDb()
  const a = schema.auditLog
  // The total is exact up to the cap (or up to the page asked for, when that lies further on).
  const cap = Math.max(COUNT_CAP, q.page * q.pageSize)
  const capped = db.select({ one: sql`1` }).from(a).where(where).limit(cap + 1).as('capped')
  const [rows, [counted]] = await Promise.all([
    db.select().from(a).where(where).orderBy(...auditOrder()).limit(q.pageSize).offset((q.page - 1) * q.pageSize),
    db.select({ n: sql<number>`count(*)::int` }).from(capped),
  ])
  const n = counted?.n ?? 0
  // Each row names its record as the pages do (sample code, vessel, plan, user…); the raw id stays beside it.
  const names = await auditRecordNames(db, rows)
  return { rows: rows.map(r => ({ ...r, entityName: r.entityId ? names[`${r.entity}:${r.entityId.toLowerCase()}`] ?? null : null })), total: Math.min(n, cap), totalIsCapped: n > cap, page: q.page, pageSize: q.pageSize }
})
