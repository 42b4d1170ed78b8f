import type { H3Event } from 'h3'
import { eq, sql } from 'drizzle-orm'
import { allows, API_ACCESS, type Who } from '#shared/access'
import type { Role } from '#shared/types/roles'

export interface AuthedUser {
  id: string
  email: string
  name: string
  roles: Role[]
}

// Routes reachable without a session; every other /api route answers 401 first.
export const PUBLIC_API_ROUTES = new Set(['POST /api/auth/login', 'GET /api/_auth/session', 'DELETE /api/_auth/session', 'GET /api/health', 'HEAD /api/health'])

/**
 * Resolves the signed-in user from the sealed cookie and the database: the cookie names a session row, which must be
 * open (not ended), not idle or older than the policy allows, and belong to an active user. Anything else ends it.
 */
export async function loadSessionUser(event: H3Event): Promise<AuthedUser | null> {
  if (event.context.user !== undefined) return event.context.user
  const session = await getUserSession(event)
  const sessionId = session.secure?.sessionId
  if (!session.user || !sessionId) {
    if (session.user) await clearUserSession(event)
    return (event.context.user = null)
  }
  const db = useDb()
  const [found] = await db.select({ s: schema.userSessions, u: schema.users }).from(schema.userSessions)
    .innerJoin(schema.users, eq(schema.users.id, schema.userSessions.userId))
    .where(eq(schema.userSessions.id, sessionId))
  const policy = await getPolicy()
  const now = Date.now()
  const idle = found ? now - found.s.lastSeenAt.getTime() > policy.sessionIdleMinutes * 60_000 : false
  const tooOld = found ? now - found.s.createdAt.getTime() > policy.sessionAbsoluteHours * 3_600_000 : false
  if (!found || found.s.revokedAt || !found.u.active || found.u.id !== session.user.id || idle || tooOld) {
    if (found && !found.s.revokedAt) await endSession(db, sessionId, found.u.active ? 'expired' : 'disabled')
    await clearUserSession(event)
    return (event.context.user = null)
  }
  const row = found.u
  const user: AuthedUser = { id: row.id, email: row.email, name: row.name, roles: row.roles as Role[] }
  // Slide the idle window in the database, at most once a minute, so that a busy page does not write at each request.
  if (now - found.s.lastSeenAt.getTime() > 60_000) {
    await db.update(schema.userSessions).set({ lastSeenAt: sql`now()` }).where(eq(schema.userSessions.id, sessionId))
  }
  event.context.sessionId = sessionId
  return (event.context.user = user)
}

/** 401 without a signed-in, active user. */
export async function requireUser(event: H3Event): Promise<AuthedUser> {
  const user = await loadSessionUser(event)
  if (!user) throw createError({ statusCode: 401, message: 'Sign in first.' })
  return user
}

/** The API_ACCESS key of the route a request matched, as the route files are named: "POST /api/runs/[id]/approve". */
export function routeKey(event: H3Event): string | null {
  const path = event.context.matchedRoute?.path
  const method = event.method === 'HEAD' ? 'GET' : event.method
  return path ? `${method} ${path.replace(/:(\w+)/g, '[$1]')}` : null
}

/**
 * 401 without a session; 403 unless the user holds one of the roles. Without roles, the roles are those shared/access.ts
 * lists for the route (API_ACCESS, the same map the pages and the route-matrix test read); a route missing there is
 * refused (fail closed).
 */
export async function requireRole(event: H3Event, ...roles: Role[]): Promise<AuthedUser> {
  const user = await requireUser(event)
  const who: Who | undefined = roles.length ? roles : API_ACCESS[routeKey(event) ?? '']
  if (!who) throw createError({ statusCode: 500, message: `${routeKey(event) ?? event.path} is missing from the access map (shared/access.ts).` })
  if (!allows(who, user.roles)) {
    throw createError({ statusCode: 403, message: `This needs the ${(who as Role[]).join(' or ')} role.` })
  }
  return user
}

export function hasRole(user: AuthedUser, ...roles: Role[]) {
  return roles.some(r => user.roles.includes(r))
}
