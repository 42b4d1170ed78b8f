import { Readable } from 'node:stream'
import { and, count, sql } from 'drizzle-orm'
import type { SQL } from 'drizzle-orm'

/** The most rows one download carries; narrow the filters for more. */
const MAX_ROWS = 50_000
const CHUNK = 2_000

const COLUMNS = ['time_utc', 'actor', 'actor_id', 'action', 'entity', 'entity_id', 'reason', 'old_values', 'new_values', 'request_id', 'audit_id']

const json = (v: unknown) => (v === null || v === undefined ? '' : JSON.stringify(v))

// The audit trail as a spreadsheet-safe CSV (server/utils/csv.ts), with the same filters as GET /api/audit, newest first.
export default defineEventHandler(async (event) => {
  await requireRole(event)
  const filter = parseQuery(event, auditFilterSchema)
  const where = auditWhere(filter)
  const db = useDb()
  const a = schema.auditLog
  const [total] = await db.select({ n: count() }).from(a).where(where)
  const matching = total?.n ?? 0

  setCsvDownload(event, 'audit', {
    'X-Total-Count': String(matching),
    'X-Emberline-Truncated': matching > MAX_ROWS ? `only the newest ${MAX_ROWS} rows` : 'no',
  })

  async function* lines() {
    yield csvHeader(COLUMNS)
    let sent = 0
    let cursor: { at: string, id: string } | null = null
    while (sent < MAX_ROWS) {
      // Keyset paging on (at, id), with the time as text so that no microseconds are lost on the way.
      const after: SQL | undefined = cursor ? sql`(${a.at}, ${a.id}) < (${cursor.at}::timestamptz, ${cursor.id}::uuid)` : undefined
      const rows: { row: typeof a.$inferSelect, atText: string }[] = await db.select({ row: a, atText: sql<string>`${a.at}::text` }).from(a)
        .where(and(where, after))
        .orderBy(...auditOrder())
        .limit(Math.min(CHUNK, MAX_ROWS - sent))
      if (!rows.length) break
      yield csvLines(rows.map(({ row: r }) => [
        r.at.toISOString(), r.actorName, r.actorId, r.action, r.entity, r.entityId, r.reason,
        json(r.oldValues), json(r.newValues), r.requestId, r.id,
      ]))
      sent += rows.length
      const last = rows[rows.length - 1]!
      cursor = { at: last.atText, id: last.row.id }
      if (rows.length < CHUNK) break
    }
  }

  return sendStream(event, Readable.from(lines()))
})
