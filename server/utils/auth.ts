import type { H3Event } from 'h3'
import { eq } from 'drizzle-orm'
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
 * Resolves the signed-in user from the sealed cookie and the database: a disabled user, a user
 * whose sessions were ended (epoch raised) or an idle/expired session stops working at once.
 */
export async function loadSessionUser(event: H3Event): Promise<AuthedUser | null> {
  if (event.context.user !== undefined) return event.context.user
  const session = await getUserSession(event)
  if (!session.user) return (event.context.user = null)
  const [row] = await useDb().select().from(schema.users).where(eq(schema.users.id, session.user.id))
  const policy = await getPolicy()
  const now = Date.now()
  const idleMs = policy.sessionIdleMinutes * 60_000
  const absoluteMs = policy.sessionAbsoluteHours * 3_600_000
  const expired = now - (session.lastSeenAt ?? 0) > idleMs || now - (session.loggedInAt ?? 0) > absoluteMs
  if (!row || !row.active || row.sessionEpoch !== session.epoch || expired) {
    await clearUserSession(event)
    return (event.context.user = null)
  }
  const user: AuthedUser = { id: row.id, email: row.email, name: row.name, roles: row.roles as Role[] }
  // Slide the idle window, at most once a minute, so that a busy page does not rewrite the cookie each request.
  if (now - session.lastSeenAt > 60_000) await setUserSession(event, { user, epoch: session.epoch, loggedInAt: session.loggedInAt, lastSeenAt: now })
  return (event.context.user = user)
}

/** 401 without a signed-in, active user. */
export async function requireUser(event: H3Event): Promise<AuthedUser> {
  const user = await loadSessionUser(event)
  if (!user) throw createError({ statusCode: 401, message: 'Sign in first.' })
  return user
}

/** 401 without a session; 403 unless the user holds one of the roles. */
export async function requireRole(event: H3Event, ...roles: Role[]): Promise<AuthedUser> {
  const user = await requireUser(event)
  if (!roles.some(r => user.roles.includes(r))) {
    throw createError({ statusCode: 403, message: `This needs the ${roles.join(' or ')} role.` })
  }
  return user
}

export function hasRole(user: AuthedUser, ...roles: Role[]) {
  return roles.some(r => user.roles.includes(r))
}
