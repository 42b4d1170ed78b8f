import { eq } from 'drizzle-orm'
import { z } from 'zod'
import type { Role } from '#shared/types/roles'

const body = z.object({
  email: z.string().trim().toLowerCase().email().max(320),
  password: z.string().min(1).max(1024),
})

// Verifying against a real hash when the account does not exist keeps the timing the same.
let dummyHash: Promise<string> | undefined

export default defineEventHandler(async (event) => {
  const { email, password } = await parseBody(event, body)
  const db = useDb()
  const ip = clientAddress(event)

  const [user] = await db.select().from(schema.users).where(eq(schema.users.email, email))
  dummyHash ??= inHashSlot(() => hashPassword('emberline-timing-equaliser'))
  let ok: boolean
  try {
    // Throttled attempts never reach the hash (server/utils/throttle.ts).
    ok = await checkPasswordThrottled(event, email, 'sign-in', user?.passwordHash ?? await dummyHash, password)
  }
  catch (err) {
    if (!(err instanceof ThrottledError)) throw err
    await db.transaction(tx => audit(tx, event, { action: 'auth.login-throttled', entity: 'user', entityId: user?.id ?? null, newValues: { email, ip, rule: err.rule, retryAfterS: err.retryAfterS }, actor: null }))
    throw throttledAnswer(event, err, 'signing in to this account from here')
  }

  if (!user || !ok || !user.active) {
    await db.transaction(tx => audit(tx, event, {
      action: 'auth.login-failed',
      entity: 'user',
      entityId: user?.id ?? null,
      newValues: { email, ip, reason: !user ? 'unknown account' : !ok ? 'wrong password' : 'account disabled' },
      actor: null,
    }))
    throw createError({ statusCode: 401, message: user && ok && !user.active ? 'This account is disabled. Ask an admin.' : 'E-mail or password is wrong.' })
  }

  const now = new Date()
  const sessionUser = { id: user.id, email: user.email, name: user.name, roles: user.roles as Role[] }
  // A fresh session row and cookie at every sign-in (no fixation).
  await db.transaction(async (tx) => {
    const session = await startSession(event, sessionUser, { db: tx })
    await tx.update(schema.users).set({ lastSignInAt: now }).where(eq(schema.users.id, user.id))
    await audit(tx, event, { action: 'auth.login', entity: 'user', entityId: user.id, newValues: { ip, sessionId: session.id }, actor: { id: user.id, name: user.name } })
  })
  return { user: sessionUser }
})
