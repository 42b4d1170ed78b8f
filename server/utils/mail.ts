// E-mail goes through the mail_outbox table: a route enqueues inside its own transaction, the
// mail worker (server/plugins/mail-worker.ts) sends later, so SMTP never slows or breaks a request.
import { and, arrayContains, asc, eq, inArray, lte, sql } from 'drizzle-orm'
import nodemailer from 'nodemailer'
import { z } from 'zod'
import type { Role } from '#shared/types/roles'
import type { Db, Tx } from './db'

export interface OutgoingMail {
  to: string[]
  subject: string
  text: string
  /** A second enqueue with the same key adds nothing (e.g. `run:<id>:approval-requested`). */
  dedupeKey?: string
}

export interface SmtpSettings {
  host: string
  port: number
  secure: boolean
  user: string
  pass: string
  from: string
}

/** After this many tries a message is marked 'failed' and left for the admin to see. */
export const MAIL_MAX_ATTEMPTS = 8
/** How many due messages one worker pass claims. */
export const MAIL_BATCH_SIZE = 10
// A claimed message is hidden from other workers this long; far above the SMTP timeouts of a whole batch.
const CLAIM_LEASE = sql`interval '15 minutes'`

const address = z.string().email()

/** Wait before the next try after `attempts` failed tries: 30 s doubling, at most 1 h (common practice for mail retries). */
export function mailRetryDelayMs(attempts: number): number {
  return Math.min(30_000 * 2 ** Math.max(0, attempts - 1), 3_600_000)
}

/**
 * Puts a message in the outbox inside the caller's transaction, so it is sent only if the change
 * that caused it commits. Never throws: a savepoint keeps a failed insert from aborting the caller's work.
 * Returns true when a row was added (false for an empty recipient list or a repeated dedupeKey).
 */
export async function enqueueMail(tx: Tx, mail: OutgoingMail): Promise<boolean> {
  const to = [...new Set(mail.to.map(a => a.trim().toLowerCase()))].filter(a => address.safeParse(a).success)
  if (!to.length) return false
  // Header safety: a subject is one line.
  const subject = mail.subject.replace(/[\r\n]+/g, ' ').trim().slice(0, 250)
  try {
    return await tx.transaction(async (sp) => {
      const rows = await sp.insert(schema.mailOutbox)
        .values({ to, subject, text: mail.text, dedupeKey: mail.dedupeKey ?? null })
        .onConflictDoNothing({ target: schema.mailOutbox.dedupeKey })
        .returning({ id: schema.mailOutbox.id })
      return rows.length > 0
    })
  }
  catch (err) {
    const e = err as Error & { cause?: Error }
    console.error('[mail] could not enqueue a message:', e.cause?.message ?? e.message)
    return false
  }
}

/** E-mail addresses of the active users who hold the role, for notifications. */
export async function recipientsWithRole(tx: Tx | Db, role: Role): Promise<string[]> {
  const rows = await tx.select({ email: schema.users.email }).from(schema.users)
    .where(and(eq(schema.users.active, true), arrayContains(schema.users.roles, [role])))
    .orderBy(asc(schema.users.email))
  return rows.map(r => r.email)
}

/** The SMTP settings in force (runtimeConfig.smtp, overridden by NUXT_SMTP_* at start). */
export function smtpSettings(): SmtpSettings {
  const s = useRuntimeConfig().smtp as Partial<Record<keyof SmtpSettings, unknown>>
  return {
    host: String(s.host || '127.0.0.1'),
    port: Number(s.port) || 2525,
    secure: s.secure === true || s.secure === 'true',
    user: String(s.user ?? ''),
    pass: String(s.pass ?? ''),
    from: String(s.from || 'Emberline <no-reply@emberline.test>'),
  }
}

export function createMailTransport(s: SmtpSettings) {
  return nodemailer.createTransport({
    host: s.host,
    port: s.port,
    secure: s.secure,
    ...(s.user ? { auth: { user: s.user, pass: s.pass } } : {}),
    // Short timeouts: a dead server must not hold a claimed batch for minutes.
    connectionTimeout: 10_000,
    greetingTimeout: 10_000,
    socketTimeout: 30_000,
  })
}

export type MailTransport = ReturnType<typeof createMailTransport>

export interface DeliveryReport { claimed: number, sent: number, retried: number, failed: number }

/**
 * One worker pass: claims due messages with SELECT … FOR UPDATE SKIP LOCKED (so several app
 * instances never take the same row), pushes the claim forward by a lease and counts the try,
 * then sends each one and records the outcome.
 */
export async function deliverDueMail(transport: MailTransport, from: string): Promise<DeliveryReport> {
  const db = useDb()
  const o = schema.mailOutbox
  const due = db.select({ id: o.id }).from(o)
    .where(and(eq(o.status, 'pending'), lte(o.nextAttemptAt, sql`now()`)))
    .orderBy(asc(o.nextAttemptAt))
    .limit(MAIL_BATCH_SIZE)
    .for('update', { skipLocked: true })
  const claimed = await db.update(o)
    .set({ attempts: sql`${o.attempts} + 1`, nextAttemptAt: sql`now() + ${CLAIM_LEASE}` })
    .where(inArray(o.id, due))
    .returning()
  const report: DeliveryReport = { claimed: claimed.length, sent: 0, retried: 0, failed: 0 }
  for (const m of claimed) {
    try {
      const info = await transport.sendMail({ from, to: m.to, subject: m.subject, text: m.text })
      const refused = info.rejected ?? []
      await db.update(o)
        .set({ status: 'sent', sentAt: new Date(), lastError: refused.length ? `refused by the server: ${refused.join(', ')}` : null })
        .where(eq(o.id, m.id))
      report.sent++
    }
    catch (err) {
      const message = (err as Error).message?.slice(0, 1000) || 'unknown SMTP error'
      const final = m.attempts >= MAIL_MAX_ATTEMPTS
      await db.update(o)
        .set({
          status: final ? 'failed' : 'pending',
          lastError: message,
          nextAttemptAt: final ? new Date() : new Date(Date.now() + mailRetryDelayMs(m.attempts)),
        })
        .where(eq(o.id, m.id))
      if (final) report.failed++
      else report.retried++
      console.warn(`[mail] message ${m.id} not sent (try ${m.attempts} of ${MAIL_MAX_ATTEMPTS}${final ? ', giving up' : ''}): ${message}`)
    }
  }
  return report
}
