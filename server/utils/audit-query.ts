// Filters of the audit trail, shared by GET /api/audit and GET /api/audit/export.csv.
import { and, eq, gte, ilike, lt, lte, or, sql } from 'drizzle-orm'
import type { SQL } from 'drizzle-orm'
import { z } from 'zod'

const DATE_ONLY = /^(\d{4})-(\d{2})-(\d{2})$/
// An explicit offset is required: a time without one would mean different instants to different people.
const DATE_TIME = /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}(?::\d{2}(?:\.\d{1,6})?)?(?:Z|[+-]\d{2}:?\d{2})$/i
const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i

/** A bound of the time filter; a bare date is a whole UTC day. */
export interface TimeBound { at: Date, dateOnly: boolean }

const blank = (v: unknown) => (typeof v === 'string' && v.trim() === '' ? undefined : v)
const text = (max: number) => z.preprocess(blank, z.string().trim().max(max, `at most ${max} characters`).optional())

const timeBound = z.preprocess(blank, z.string().trim().optional()).transform((v, ctx): TimeBound | undefined => {
  if (v === undefined) return undefined
  const d = DATE_ONLY.exec(v)
  if (d) {
    const at = new Date(Date.UTC(Number(d[1]), Number(d[2]) - 1, Number(d[3])))
    // Date.UTC rolls 2026-02-30 over to March: a rolled date was not a real date.
    if (at.toISOString().slice(0, 10) === v) return { at, dateOnly: true }
  }
  else if (DATE_TIME.test(v) && !Number.isNaN(Date.parse(v))) {
    return { at: new Date(v), dateOnly: false }
  }
  ctx.addIssue({ code: 'custom', message: 'a date as YYYY-MM-DD (UTC) or a date-time with its offset, e.g. 2026-03-01T08:00:00Z' })
  return z.NEVER
})

export const auditFilterSchema = z.object({
  entity: text(60),
  entityId: text(200),
  actor: text(120),
  action: text(80),
  from: timeBound,
  to: timeBound,
}).superRefine((q, ctx) => {
  if (q.from && q.to && q.from.at > q.to.at) ctx.addIssue({ code: 'custom', path: ['to'], message: 'must not be before "from"' })
})

export const auditPageSchema = z.object({
  page: z.coerce.number().int('a whole number').min(1, 'at least 1').max(1_000_000).default(1),
  pageSize: z.coerce.number().int('a whole number').min(1, 'at least 1').max(200, 'at most 200').default(50),
})

export type AuditFilter = z.output<typeof auditFilterSchema>

// LIKE treats % and _ as wildcards; a person's search text must match literally.
const likeLiteral = (s: string) => s.replace(/[\\%_]/g, '\\$&')

/** The WHERE clause for the filters: entity and entity id exactly, action or its family ("user" → user.*), actor by id or part of the name. */
export function auditWhere(f: AuditFilter): SQL | undefined {
  const a = schema.auditLog
  const parts: (SQL | undefined)[] = []
  if (f.entity) parts.push(eq(a.entity, f.entity))
  if (f.entityId) parts.push(eq(a.entityId, f.entityId))
  if (f.action) parts.push(or(ilike(a.action, likeLiteral(f.action)), ilike(a.action, `${likeLiteral(f.action)}.%`)))
  if (f.actor) {
    const byName = ilike(a.actorName, `%${likeLiteral(f.actor)}%`)
    parts.push(UUID.test(f.actor) ? or(eq(a.actorId, f.actor.toLowerCase()), byName) : byName)
  }
  if (f.from) parts.push(gte(a.at, f.from.at))
  if (f.to) {
    // A bare date includes the whole of that UTC day.
    parts.push(f.to.dateOnly ? lt(a.at, new Date(f.to.at.getTime() + 86_400_000)) : lte(a.at, f.to.at))
  }
  return parts.length ? and(...parts) : undefined
}

/** Newest first; the id breaks ties between rows of the same instant so that pages never overlap. */
export const auditOrder = () => [sql`${schema.auditLog.at} desc`, sql`${schema.auditLog.id} desc`]
