import { describe, expect, it } from 'vitest'
import { as, call, sessionCookie, signIn, unique } from '../support/api'
import { auditRows } from '../support/db'

async function newUser(roles: string[] = ['analyst']) {
  const admin = await as('admin')
  const email = `${unique('u')}@emberline.test`
  const password = 'correct horse battery'
  const res = await call('POST', '/api/admin/users', { cookie: admin, body: { email, name: 'Test Person', roles, password } })
  expect(res.status).toBe(201)
  return { id: res.body.id as string, email, password }
}

describe('sign-in', () => {
  it('answers the user with its roles and a session cookie', async () => {
    const res = await call('POST', '/api/auth/login', { body: { email: 'supervisor@emberline.test', password: 'ember-demo-2026' } })
    expect(res.status).toBe(200)
    expect(res.body.user).toMatchObject({ email: 'supervisor@emberline.test', roles: ['supervisor'] })
    expect(Object.keys(res.body.user).sort()).toEqual(['email', 'id', 'name', 'roles'])
    const cookie = res.headers.getSetCookie().join(';')
    expect(cookie).toMatch(/HttpOnly/i)
    expect(cookie).toMatch(/SameSite=Lax/i)
    expect(res.body.user.passwordHash).toBeUndefined()
  })

  it('refuses a wrong password with 401 and audits the failure', async () => {
    const u = await newUser()
    const since = new Date()
    const res = await call('POST', '/api/auth/login', { body: { email: u.email, password: 'not the password' } })
    expect(res.status).toBe(401)
    const rows = await auditRows({ action: 'auth.login-failed', entityId: u.id, since })
    expect(rows).toHaveLength(1)
    expect(rows[0].new_values.reason).toBe('wrong password')
  })

  it('audits a successful sign-in', async () => {
    const u = await newUser()
    const since = new Date()
    await signIn(u.email, u.password)
    expect(await auditRows({ action: 'auth.login', entityId: u.id, since })).toHaveLength(1)
  })

  it('slows one address down after 3 wrong passwords, then refuses it for 15 minutes, even the right password', async () => {
    const u = await newUser()
    const wrong = (i: number) => call('POST', '/api/auth/login', { body: { email: u.email, password: `wrong-${i}` } })
    for (let i = 0; i < 3; i++) expect((await wrong(i)).status).toBe(401)
    // Back-off: the next try waits 2 s, the one after 4 s; the refused tries are not checked against the hash.
    const early = await wrong(3)
    expect(early.status).toBe(429)
    expect(Number(early.headers.get('retry-after'))).toBeGreaterThanOrEqual(1)
    expect(Number(early.headers.get('retry-after'))).toBeLessThanOrEqual(2)
    await new Promise(r => setTimeout(r, 2_100))
    expect((await wrong(4)).status).toBe(401)
    await new Promise(r => setTimeout(r, 4_100))
    expect((await wrong(5)).status).toBe(401)
    const blocked = await call('POST', '/api/auth/login', { body: { email: u.email, password: u.password } })
    expect(blocked.status).toBe(429)
    expect(Number(blocked.headers.get('retry-after'))).toBeGreaterThan(800)
    expect(blocked.body.message).toMatch(/Too many wrong passwords/)
    // An admin's password reset lifts the throttle.
    const admin = await as('admin')
    expect((await call('POST', `/api/admin/users/${u.id}/password`, { cookie: admin, body: { password: 'another long password' } })).status).toBe(200)
    expect((await call('POST', '/api/auth/login', { body: { email: u.email, password: 'another long password' } })).status).toBe(200)
  })

  it('names the failing fields of a malformed sign-in with 422', async () => {
    const res = await call('POST', '/api/auth/login', { body: { email: 'not-an-email' } })
    expect(res.status).toBe(422)
    const paths = res.body.data.fields.map((f: { path: string }) => f.path)
    expect(paths).toEqual(expect.arrayContaining(['email', 'password']))
  })

  it('answers 400 for a body that is not JSON', async () => {
    const res = await call('POST', '/api/auth/login', { raw: '{"email":', headers: { 'content-type': 'application/json' } })
    expect(res.status).toBe(400)
  })

  it('ends a disabled user\'s existing session on its next request', async () => {
    const u = await newUser()
    const cookie = await signIn(u.email, u.password)
    expect((await call('GET', '/api/settings', { cookie })).status).toBe(200)
    const admin = await as('admin')
    const since = new Date()
    expect((await call('PATCH', `/api/admin/users/${u.id}`, { cookie: admin, body: { active: false } })).status).toBe(200)
    expect((await call('GET', '/api/settings', { cookie })).status).toBe(401)
    expect((await call('POST', '/api/auth/login', { body: { email: u.email, password: u.password } })).status).toBe(401)
    const rows = await auditRows({ action: 'user.disable', entityId: u.id, since })
    expect(rows).toHaveLength(1)
    expect(rows[0].old_values.active).toBe(true)
    expect(rows[0].new_values.active).toBe(false)
  })

  it('ends the session at sign-out, also for a copy of the cookie', async () => {
    const u = await newUser()
    const res = await call('POST', '/api/auth/login', { body: { email: u.email, password: u.password } })
    const cookie = sessionCookie(res.headers)
    expect((await call('GET', '/api/plans', { cookie })).status).toBe(200)
    const out = await call('POST', '/api/auth/logout', { cookie })
    expect(out.status).toBe(200)
    // The sealed cookie is replaced by an empty one; the browser drops the old one.
    expect(out.headers.getSetCookie().join(';')).toMatch(/emberline-session=/)
    // A copy of the old cookie is refused: the session row has ended on the server.
    expect((await call('GET', '/api/plans', { cookie })).status).toBe(401)
    expect((await call('GET', '/api/settings', { cookie })).status).toBe(401)
  })

  it('lets an admin end all of a user\'s sessions', async () => {
    const u = await newUser()
    const cookie = await signIn(u.email, u.password)
    const admin = await as('admin')
    expect((await call('POST', `/api/admin/users/${u.id}/sign-out`, { cookie: admin })).status).toBe(200)
    expect((await call('GET', '/api/settings', { cookie })).status).toBe(401)
  })
})

describe('user administration', () => {
  it('creates, edits and audits users; refuses a duplicate e-mail with 409', async () => {
    const u = await newUser(['technician'])
    const admin = await as('admin')
    expect((await auditRows({ action: 'user.create', entityId: u.id }))).toHaveLength(1)
    const dup = await call('POST', '/api/admin/users', { cookie: admin, body: { email: u.email, name: 'Again', roles: ['analyst'], password: 'long enough password' } })
    expect(dup.status).toBe(409)
    const res = await call('PATCH', `/api/admin/users/${u.id}`, { cookie: admin, body: { roles: ['technician', 'analyst'], name: 'Renamed Person' } })
    expect(res.status).toBe(200)
    expect(res.body).toMatchObject({ name: 'Renamed Person', roles: ['technician', 'analyst'] })
    expect(await auditRows({ action: 'user.update', entityId: u.id })).toHaveLength(1)
  })

  it('refuses a short password and an unknown role, naming the fields, and creates nothing', async () => {
    const admin = await as('admin')
    const email = `${unique('bad')}@emberline.test`
    const res = await call('POST', '/api/admin/users', { cookie: admin, body: { email, name: 'X', roles: ['wizard'], password: 'short' } })
    expect(res.status).toBe(422)
    const paths = res.body.data.fields.map((f: { path: string }) => f.path)
    expect(paths).toEqual(expect.arrayContaining(['roles.0', 'password']))
    const list = await call('GET', '/api/admin/users', { cookie: admin })
    expect(list.body.some((x: { email: string }) => x.email === email)).toBe(false)
  })

  it('never lets the lab lose its last active admin', async () => {
    const admin = await as('admin')
    const list = await call('GET', '/api/admin/users', { cookie: admin })
    const admins = list.body.filter((x: { roles: string[], active: boolean }) => x.roles.includes('admin') && x.active)
    if (admins.length === 1) {
      const res = await call('PATCH', `/api/admin/users/${admins[0].id}`, { cookie: admin, body: { roles: ['analyst'] } })
      expect(res.status).toBe(409)
    }
    const me = list.body.find((x: { email: string }) => x.email === 'admin@emberline.test')
    expect((await call('PATCH', `/api/admin/users/${me.id}`, { cookie: admin, body: { active: false } })).status).toBe(409)
  })

  it('never returns password hashes', async () => {
    const admin = await as('admin')
    const list = await call('GET', '/api/admin/users', { cookie: admin })
    expect(JSON.stringify(list.body)).not.toMatch(/scrypt|password/i)
  })
})
