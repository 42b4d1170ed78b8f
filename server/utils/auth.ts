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

// The session row and its user, read at every request: an ended session or a disabled user is refused at once, on
// every instance. Prepared once per process (the statement is planned once per database connection).
let sessionQuery: ReturnType<typeof prepareSessionQuery> | undefined
function prepareSessionQuery() {
  const s = schema.userSessions
  const u = schema.users
  return useDb().select({
    revokedAt: s.revokedAt, lastSeenAt: s.lastSeenAt, createdAt: s.createdAt,
    userId: u.id, email: u.email, name: u.name, roles: u.roles, active: u.active,
  }).from(s).innerJoin(u, eq(u.id, s.userId)).where(eq(s.id, sql.placeholder('id'))).prepare('emberline_session_user')
}

/**
 * A server render's own requests (each useFetch during rendering is an internal request) carry the render's context
 * in `__unenv__`, which a request from the network never has. The first of them to resolve the session leaves the
 * answer there, and the others of the same render take it instead of reading the same rows again.
 */
type RenderContext = { renderSession?: { sessionId: string, user: Promise<AuthedUser | null> } }
function renderContext(event: H3Event): RenderContext | undefined {
  const context = (event.node.req as { __unenv__?: RenderContext }).__unenv__
  return context && context !== event.context ? context : undefined
}

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
  const render = renderContext(event)
  const shared = render?.renderSession?.sessionId === sessionId ? await render.renderSession.user : null
  if (shared) {
    event.context.sessionId = sessionId
    return (event.context.user = shared)
  }
  const resolving = resolveSession(event, sessionId, session.user.id)
  if (render) render.renderSession = { sessionId, user: resolving }
  return (event.context.user = await resolving)
}

async function resolveSession(event: H3Event, sessionId: string, cookieUserId: string): Promise<AuthedUser | null> {
  const db = useDb()
  sessionQuery ??= prepareSessionQuery()
  const [[found], policy] = await Promise.all([sessionQuery.execute({ id: sessionId }), getPolicy()])
  const now = Date.now()
  const idle = found ? now - found.lastSeenAt.getTime() > policy.sessionIdleMinutes * 60_000 : false
  const tooOld = found ? now - found.createdAt.getTime() > policy.sessionAbsoluteHours * 3_600_000 : false
  if (!found || found.revokedAt || !found.active || found.userId !== cookieUserId || idle || tooOld) {
    if (found && !found.revokedAt) await endSession(db, sessionId, found.active ? 'expired' : 'disabled')
    await clearUserSession(event)
    return null
  }
  // Slide the idle window in the database, at most once a minute, so that a busy page does not write at each request.
  if (now - found.lastSeenAt.getTime() > 60_000) {
    await db.update(schema.userSessions).set({ lastSeenAt: sql`now()` }).where(eq(schema.userSessions.id, sessionId))
  }
  event.context.sessionId = sessionId
  return { id: found.userId, email: found.email, name: found.name, roles: found.roles as Role[] }
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
