import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { baseURL, call, signIn } from '../support/api'
import { auditRows, testDb } from '../support/db'
import { newUser } from '../support/factories'
import { startServer } from '../support/server-process'
import type { ServerProcess } from '../support/server-process'

// The password throttle (server/utils/throttle.ts; OWASP ASVS 4.0.3 V2.2.1): atomic under concurrency, the hash never
// computed for a refused attempt, and no stranger able to keep the owner out. Each attempt that reaches the hash is
// one row in login_attempts (written before the hash is computed), so those rows count the hashes.
async function hashedAttempts(email: string, purpose?: string) {
  const { rows } = await testDb().query('select count(*)::int as n from login_attempts where email = $1 and ($2::text is null or purpose = $2)', [email, purpose ?? null])
  return rows[0].n as number
}

describe('sign-in throttle under a burst', () => {
  it('checks at most the limit of 16 concurrent wrong passwords against the hash; the rest get 429 with Retry-After', async () => {
    const u = await newUser()
    const since = new Date()
    const health: number[] = []
    const burst = Promise.all(Array.from({ length: 16 }, (_, i) => call('POST', '/api/auth/login', { body: { email: u.email, password: `wrong-${i}` } })))
    // The server keeps answering other requests meanwhile (the timing itself is measured in npm run bench).
    for (let i = 0; i < 5; i++) health.push((await fetch(`${baseURL()}/api/health`)).status)
    const replies = await burst
    const statuses = replies.map(r => r.status)
    expect(statuses.every(s => s === 401 || s === 429)).toBe(true)
    const hashed = await hashedAttempts(u.email)
    expect(hashed).toBeLessThanOrEqual(5)
    expect(statuses.filter(s => s === 401)).toHaveLength(hashed)
    for (const r of replies.filter(x => x.status === 429)) expect(Number(r.headers.get('retry-after'))).toBeGreaterThan(0)
    expect(await auditRows({ action: 'auth.login-failed', entityId: u.id, since })).toHaveLength(hashed)
    expect(await auditRows({ action: 'auth.login-throttled', entityId: u.id, since })).toHaveLength(16 - hashed)
    expect(health.every(s => s === 200)).toBe(true)
  })

  it('puts signature passwords under the same throttle, counted with sign-ins', async () => {
    const u = await newUser()
    const cookie = await signIn(u.email, u.password)
    const change = (currentPassword: string) => call('POST', '/api/account/password', { cookie, body: { currentPassword, newPassword: 'cobalt violin orchard' } })
    for (let i = 0; i < 3; i++) expect((await change(`wrong-${i}`)).status).toBe(403)
    const refused = await change('wrong-3')
    expect(refused.status).toBe(429)
    expect(refused.headers.get('retry-after')).toBeTruthy()
    // The same account from the same address: sign-in waits too, even with the right password.
    expect((await call('POST', '/api/auth/login', { body: { email: u.email, password: u.password } })).status).toBe(429)
    expect(await hashedAttempts(u.email, 'signature')).toBe(3)
    expect(await hashedAttempts(u.email, 'sign-in')).toBe(1)
    expect(await auditRows({ action: 'signature.throttled', entityId: u.id })).toHaveLength(1)
  })
})

describe('a stranger cannot keep the owner out (addresses through a trusted proxy)', () => {
  let server: ServerProcess
  beforeAll(async () => { server = await startServer({ EMBERLINE_TRUST_PROXY: '1', EMBERLINE_REMINDERS: 'off' }) })
  afterAll(async () => { await server?.stop() })

  const login = (email: string, password: string, ip: string) => fetch(`${server.baseURL}/api/auth/login`, {
    method: 'POST', headers: { 'content-type': 'application/json', 'x-forwarded-for': ip }, body: JSON.stringify({ email, password }),
  })

  it('refuses the guessing address, not the owner\'s, and locks new addresses only briefly after guesses from many', async () => {
    const u = await newUser()
    const net = Math.floor(Math.random() * 200) + 20
    const owner = `10.${net}.0.1`
    expect((await login(u.email, u.password, owner)).status).toBe(200)
    // One stranger's address: three guesses, then back-off for that address only.
    const stranger = `10.${net}.9.1`
    for (let i = 0; i < 3; i++) expect((await login(u.email, `guess-${i}`, stranger)).status).toBe(401)
    expect((await login(u.email, 'guess-3', stranger)).status).toBe(429)
    expect((await login(u.email, u.password, owner)).status).toBe(200)
    expect((await login(u.email, u.password, `10.${net}.5.5`)).status).toBe(200)
    // Guesses from six more addresses: at 20 failures new addresses wait, the address the owner signed in from does not.
    const guesses: number[] = []
    for (let a = 2; a <= 7; a++) {
      for (let i = 0; i < 3; i++) guesses.push((await login(u.email, `guess-${a}-${i}`, `10.${net}.9.${a}`)).status)
    }
    expect(guesses.filter(s => s === 401)).toHaveLength(17)
    expect(guesses.at(-1)).toBe(429)
    const fresh = await login(u.email, u.password, `10.${net}.7.7`)
    expect(fresh.status).toBe(429)
    expect(Number(fresh.headers.get('retry-after'))).toBeLessThanOrEqual(300)
    expect((await login(u.email, u.password, owner)).status).toBe(200)
  })
})
