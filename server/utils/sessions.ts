// Server-side sessions: each sign-in writes a row in user_sessions and the sealed cookie names it. Ending the row
// (sign-out, a password change, a role change, disabling, "sign out everywhere") ends the session at its next request,
// wherever the cookie was copied to.
import type { H3Event } from 'h3'
import { and, eq, isNull, ne } from 'drizzle-orm'
import type { SessionEndReason } from '#shared/states'
import type { AuthedUser } from './auth'

/** The client address as the throttle and the session list see it: X-Forwarded-For only behind a trusted proxy. */
export function clientAddress(event: H3Event): string {
  return getRequestIP(event, { xForwardedFor: process.env.EMBERLINE_TRUST_PROXY === '1' }) ?? 'unknown'
}

/** Opens a session row for the user and seals its id into a fresh cookie (a new cookie at each sign-in: no fixation). */
export async function startSession(event: H3Event, user: AuthedUser, opts: { createdAt?: Date, db?: Db | Tx } = {}) {
  const { createdAt, db = useDb() } = opts
  const [row] = await db.insert(schema.userSessions).values({
    userId: user.id,
    userAgent: (getRequestHeader(event, 'user-agent') ?? '').slice(0, 300) || null,
    ip: clientAddress(event),
    ...(createdAt ? { createdAt } : {}),
  }).returning()
  await replaceUserSession(event, { user, loggedInAt: row!.createdAt.getTime(), secure: { sessionId: row!.id } })
  event.context.sessionId = row!.id
  return row!
}

/**
 * A freshly sealed cookie after a signature, for the same session row: the sign-in time and the row stay, so that the
 * absolute limit holds and the user's other tabs keep working. (A new row is made at every sign-in.)
 */
export async function renewSession(event: H3Event) {
  const user = await requireUser(event)
  const session = await getUserSession(event)
  const sessionId = event.context.sessionId
  if (!sessionId) return
  // replaceUserSession re-seals without the clear hook, so the row stays open.
  await replaceUserSession(event, { user, loggedInAt: session.loggedInAt, secure: { sessionId } })
}

/** Ends one session (no-op when already ended). */
export async function endSession(db: Db | Tx, id: string, reason: SessionEndReason) {
  return db.update(schema.userSessions).set({ revokedAt: new Date(), revokedReason: reason })
    .where(and(eq(schema.userSessions.id, id), isNull(schema.userSessions.revokedAt))).returning({ id: schema.userSessions.id })
}

/** Ends every open session of a user, except `keepId` (the session asking, when it should stay signed in). */
export async function endUserSessions(db: Db | Tx, userId: string, reason: SessionEndReason, keepId?: string) {
  const rows = await db.update(schema.userSessions).set({ revokedAt: new Date(), revokedReason: reason })
    .where(and(eq(schema.userSessions.userId, userId), isNull(schema.userSessions.revokedAt), ...(keepId ? [ne(schema.userSessions.id, keepId)] : [])))
    .returning({ id: schema.userSessions.id })
  return rows.length
}
