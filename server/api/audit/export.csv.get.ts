import { Readable } from 'node:stream'
import { and, count, sql } from 'drizzle-orm'
import type { SQL } from 'drizzle-orm'

/** The most rows one download carries; narrow the filters for more. */
const MAX_ROWS = 50_000
const CHUNK = 2_000

const COLUMNS = ['time_utc', 'actor', 'actor_id', 'action', 'entity', 'entity_id', 'reason', 'old_values', 'new_values', 'request_id', 'audit_id']

/**
 * One CSV field (RFC 4180: quoted when it holds a comma, quote or line break; quotes doubled).
 * A field starting with = + - @ (or tab / CR) gets a leading ' so a spreadsheet shows it as text
 * instead of running it as a formula (OWASP, CSV injection).
 */
function csvField(value: string | null | undefined): string {
  let s = value ?? ''
  if (/^[=+\-@\t\r]/.test(s)) s = `'${s}`
  return /[",\r\n]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s
}

const json = (v: unknown) => (v === null || v === undefined ? '' : JSON.stringify(v))

// The audit trail as a spreadsheet-safe CSV, with the same filters as GET /api/audit, newest first.
export default defineEventHandler(async (event) => {
  await requireRole(event, 'supervisor', 'admin')
  const filter = parseQuery(event, auditFilterSchema)
  const where = auditWhere(filter)
  const db = useDb()
  const a = schema.auditLog
  const [total] = await db.select({ n: count() }).from(a).where(where)
  const matching = total?.n ?? 0

  const stamp = new Date().toISOString().slice(0, 10).replace(/-/g, '')
  setResponseHeaders(event, {
    'Content-Type': 'text/csv; charset=utf-8',
    'Content-Disposition': `attachment; filename="emberline-audit-${stamp}.csv"`,
    'Cache-Control': 'no-store',
    'X-Total-Count': String(matching),
    'X-Emberline-Truncated': matching > MAX_ROWS ? `only the newest ${MAX_ROWS} rows` : 'no',
  })

  async function* lines() {
    // The byte-order mark lets spreadsheet programs read the names as UTF-8.
    yield `\uFEFF${COLUMNS.join(',')}\r\n`
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
      yield rows.map(({ row: r }) => [
        r.at.toISOString(), r.actorName, r.actorId, r.action, r.entity, r.entityId, r.reason,
        json(r.oldValues), json(r.newValues), r.requestId, r.id,
      ].map(csvField).join(',') + '\r\n').join('')
      sent += rows.length
      const last = rows[rows.length - 1]!
      cursor = { at: last.atText, id: last.row.id }
      if (rows.length < CHUNK) break
    }
  }

  return sendStream(event, Readable.from(lines()))
})
