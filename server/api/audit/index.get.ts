import { count } from 'drizzle-orm'

// The audit trail, newest first, for those who answer for the lab's records. Read-only: no route changes it.
export default defineEventHandler(async (event) => {
  await requireRole(event, 'supervisor', 'admin')
  const q = parseQuery(event, auditFilterSchema.and(auditPageSchema))
  const where = auditWhere(q)
  const db = useDb()
  const a = schema.auditLog
  const [rows, [total]] = await Promise.all([
    db.select().from(a).where(where).orderBy(...auditOrder()).limit(q.pageSize).offset((q.page - 1) * q.pageSize),
    db.select({ n: count() }).from(a).where(where),
  ])
  // Each row names its record as the pages do (sample code, vessel, plan, user…); the raw id stays beside it.
  const names = await auditRecordNames(db, rows)
  return { rows: rows.map(r => ({ ...r, entityName: r.entityId ? names[`${r.entity}:${r.entityId.toLowerCase()}`] ?? null : null })), total: total?.n ?? 0, page: q.page, pageSize: q.pageSize }
})
