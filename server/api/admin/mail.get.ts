import { count, desc, sql } from 'drizzle-orm'
import { z } from 'zod'

const query = z.object({
  page: z.coerce.number().int('a whole number').min(1).max(100000).default(1),
  pageSize: z.coerce.number().int('a whole number').min(1).max(100, 'at most 100').default(25),
})

// How many outbox rows the page lists: the newest, with every unsent one first in view.
const OUTBOX_ROWS = 100

/** What the built-in test mail server caught, and the outbox with each message's sending state. */
export default defineEventHandler(async (event) => {
  await requireRole(event)
  const { page, pageSize } = parseQuery(event, query)
  const db = useDb()
  const c = schema.capturedMail
  const o = schema.mailOutbox
  const [rows, [total], outboxRows, counts] = await Promise.all([
    db.select().from(c).orderBy(desc(c.receivedAt), desc(c.id)).limit(pageSize).offset((page - 1) * pageSize),
    db.select({ n: count() }).from(c),
    db.select().from(o)
      // Unsent first (they need attention), then the newest.
      .orderBy(sql`case ${o.status} when 'failed' then 0 when 'pending' then 1 else 2 end`, desc(o.createdAt))
      .limit(OUTBOX_ROWS),
    db.select({ status: o.status, n: count() }).from(o).groupBy(o.status),
  ])
  const smtp = smtpSettings()
  return {
    captured: { rows, total: total?.n ?? 0, page, pageSize },
    outbox: {
      rows: outboxRows.map(r => ({
        id: r.id, to: r.to, subject: r.subject, status: r.status, attempts: r.attempts, maxAttempts: MAIL_MAX_ATTEMPTS,
        text: r.text, lastError: r.lastError, nextAttemptAt: r.nextAttemptAt, sentAt: r.sentAt, createdAt: r.createdAt,
      })),
      counts: Object.fromEntries(counts.map(r => [r.status, r.n])) as Record<string, number>,
    },
    // Where Emberline sends (never the password).
    smtp: { host: smtp.host, port: smtp.port, secure: smtp.secure, from: smtp.from, authenticated: !!smtp.user },
  }
})
