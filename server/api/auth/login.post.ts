import { and, count, eq, gt } from 'drizzle-orm'
import { z } from 'zod'
import type { Role } from '#shared/types/roles'

const body = z.object({
  email: z.string().trim().toLowerCase().email().max(320),
  password: z.string().min(1).max(1024),
})

// Throttling windows (OWASP ASVS 2.2.1): per account and per address, counted in the database.
const WINDOW_MS = 15 * 60_000
const MAX_FAILURES_PER_ACCOUNT = 5
const MAX_FAILURES_PER_ADDRESS = 20
// Verifying against a real hash when the account does not exist keeps the timing the same.
let dummyHash: Promise<string> | undefined

export default defineEventHandler(async (event) => {
  const { email, password } = await parseBody(event, body)
  const db = useDb()
  // X-Forwarded-For is believed only behind a proxy the lab runs; otherwise anyone could rotate it past the throttle.
  const ip = getRequestIP(event, { xForwardedFor: process.env.EMBERLINE_TRUST_PROXY === '1' }) ?? 'unknown'
  const since = new Date(Date.now() - WINDOW_MS)

  const [byAccount] = await db.select({ n: count() }).from(schema.loginAttempts)
    .where(and(eq(schema.loginAttempts.email, email), eq(schema.loginAttempts.success, false), gt(schema.loginAttempts.at, since)))
  const [byAddress] = await db.select({ n: count() }).from(schema.loginAttempts)
    .where(and(eq(schema.loginAttempts.ip, ip), eq(schema.loginAttempts.success, false), gt(schema.loginAttempts.at, since)))
  if ((byAccount?.n ?? 0) >= MAX_FAILURES_PER_ACCOUNT || (byAddress?.n ?? 0) >= MAX_FAILURES_PER_ADDRESS) {
    await db.transaction(tx => audit(tx, event, { action: 'auth.login-throttled', entity: 'user', newValues: { email, ip }, actor: null }))
    setResponseHeader(event, 'Retry-After', WINDOW_MS / 1000)
    throw createError({ statusCode: 429, message: 'Too many failed sign-ins. Wait 15 minutes or ask an admin to reset the password.' })
  }

  const [user] = await db.select().from(schema.users).where(eq(schema.users.email, email))
  dummyHash ??= hashPassword('emberline-timing-equaliser')
  const ok = await verifyPassword(user?.passwordHash ?? await dummyHash, password)

  if (!user || !ok || !user.active) {
    await db.transaction(async (tx) => {
      await tx.insert(schema.loginAttempts).values({ email, ip, success: false })
      await audit(tx, event, {
        action: 'auth.login-failed',
        entity: 'user',
        entityId: user?.id ?? null,
        newValues: { email, ip, reason: !user ? 'unknown account' : !ok ? 'wrong password' : 'account disabled' },
        actor: null,
      })
    })
    throw createError({ statusCode: 401, message: user && ok && !user.active ? 'This account is disabled. Ask an admin.' : 'E-mail or password is wrong.' })
  }

  const now = new Date()
  await db.transaction(async (tx) => {
    await tx.insert(schema.loginAttempts).values({ email, ip, success: true })
    await tx.update(schema.users).set({ lastSignInAt: now }).where(eq(schema.users.id, user.id))
    await audit(tx, event, { action: 'auth.login', entity: 'user', entityId: user.id, newValues: { ip }, actor: { id: user.id, name: user.name } })
  })
  const sessionUser = { id: user.id, email: user.email, name: user.name, roles: user.roles as Role[] }
  // A fresh session at every sign-in (no fixation).
  await replaceUserSession(event, { user: sessionUser, epoch: user.sessionEpoch, loggedInAt: now.getTime(), lastSeenAt: now.getTime() })
  return { user: sessionUser }
})
