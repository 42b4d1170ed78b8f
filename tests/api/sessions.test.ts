import { describe, expect, it } from 'vitest'
import { as, call, signIn, unique } from '../support/api'
import { auditRows, testDb } from '../support/db'
import { newUser } from '../support/factories'

// Server-side sessions: the cookie names a session row, and ending the row ends the session wherever the cookie is.
describe('sessions', () => {
  it('lists a user\'s open sessions, marks this one, and ends another on request', async () => {
    const u = await newUser()
    const a = await signIn(u.email, u.password)
    const b = await signIn(u.email, u.password)
    const list = await call('GET', '/api/account/sessions', { cookie: a })
    expect(list.status).toBe(200)
    expect(list.body).toHaveLength(2)
    expect(list.body.filter((s: { current: boolean }) => s.current)).toHaveLength(1)
    const other = list.body.find((s: { current: boolean }) => !s.current)
    expect(other).toMatchObject({ ip: expect.any(String) })
    const since = new Date()
    expect((await call('POST', `/api/account/sessions/${other.id}/end`, { cookie: a })).status).toBe(200)
    expect((await call('GET', '/api/plans', { cookie: b })).status).toBe(401)
    expect((await call('GET', '/api/plans', { cookie: a })).status).toBe(200)
    expect(await auditRows({ action: 'user.session-end', entityId: u.id, since })).toHaveLength(1)
    // Someone else's session is not yours to end.
    const c = await signIn(u.email, u.password)
    const mine = (await call('GET', '/api/account/sessions', { cookie: c })).body.find((s: { current: boolean }) => s.current)
    expect((await call('POST', `/api/account/sessions/${mine.id}/end`, { cookie: await as('analyst') })).status).toBe(404)
    expect((await call('GET', '/api/plans', { cookie: c })).status).toBe(200)
  })

  it('signs out everywhere else and keeps this browser signed in', async () => {
    const u = await newUser()
    const [a, b, c] = [await signIn(u.email, u.password), await signIn(u.email, u.password), await signIn(u.email, u.password)]
    const res = await call('POST', '/api/account/sign-out-others', { cookie: c })
    expect(res.body).toMatchObject({ ok: true, ended: 2 })
    expect((await call('GET', '/api/settings', { cookie: a })).status).toBe(401)
    expect((await call('GET', '/api/settings', { cookie: b })).status).toBe(401)
    expect((await call('GET', '/api/settings', { cookie: c })).status).toBe(200)
  })

  it('ends every session at a role change, but not at a change of name', async () => {
    const u = await newUser()
    const cookie = await signIn(u.email, u.password)
    const admin = await as('admin')
    expect((await call('PATCH', `/api/admin/users/${u.id}`, { cookie: admin, body: { name: 'Renamed Person' } })).status).toBe(200)
    expect((await call('GET', '/api/settings', { cookie })).status).toBe(200)
    expect((await call('PATCH', `/api/admin/users/${u.id}`, { cookie: admin, body: { roles: ['technician'] } })).status).toBe(200)
    expect((await call('GET', '/api/settings', { cookie })).status).toBe(401)
    const { rows } = await testDb().query('select revoked_reason from user_sessions where user_id = $1', [u.id])
    expect(rows.map(r => r.revoked_reason)).toEqual(['role-change'])
  })
})

describe('changing one\'s own password', () => {
  it('needs the current password, refuses a weak new one, and ends the other sessions only', async () => {
    const u = await newUser()
    const here = await signIn(u.email, u.password)
    const elsewhere = await signIn(u.email, u.password)
    const wrong = await call('POST', '/api/account/password', { cookie: here, body: { currentPassword: 'not it at all', newPassword: 'violet harbour engine' } })
    expect(wrong.status).toBe(403)
    expect(wrong.body.data.fields[0].path).toBe('currentPassword')
    for (const weak of ['password1234', 'a'.repeat(12), 'qwertyuiop12']) {
      const res = await call('POST', '/api/account/password', { cookie: here, body: { currentPassword: u.password, newPassword: weak } })
      expect(res.status, weak).toBe(422)
      expect(res.body.data.fields[0].path).toBe('newPassword')
    }
    const since = new Date()
    const ok = await call('POST', '/api/account/password', { cookie: here, body: { currentPassword: u.password, newPassword: 'violet harbour engine' } })
    expect(ok.body).toMatchObject({ ok: true, sessionsEnded: 1 })
    expect((await call('GET', '/api/settings', { cookie: here })).status).toBe(200)
    expect((await call('GET', '/api/settings', { cookie: elsewhere })).status).toBe(401)
    expect((await call('POST', '/api/auth/login', { body: { email: u.email, password: u.password } })).status).toBe(401)
    await signIn(u.email, 'violet harbour engine')
    expect(await auditRows({ action: 'user.password-change', entityId: u.id, since })).toHaveLength(1)
  })
})

describe('password strength', () => {
  it('refuses common and easily guessed passwords with 422 naming the field, on create and on reset', async () => {
    const admin = await as('admin')
    for (const weak of ['password1234', 'aaaaaaaaaaaa', 'Password1234']) {
      const email = `${unique('weak')}@emberline.test`
      const res = await call('POST', '/api/admin/users', { cookie: admin, body: { email, name: 'Weak Person', roles: ['analyst'], password: weak } })
      expect(res.status, weak).toBe(422)
      expect(res.body.data.fields.map((f: { path: string }) => f.path)).toEqual(['password'])
      expect(res.body.data.fields[0].message).toMatch(/common|guess/)
    }
    const u = await newUser()
    const reset = await call('POST', `/api/admin/users/${u.id}/password`, { cookie: admin, body: { password: 'password1234' } })
    expect(reset.status).toBe(422)
    expect(reset.body.data.fields[0].path).toBe('password')
    // A password built from the user's own e-mail is refused too.
    const own = await call('POST', `/api/admin/users/${u.id}/password`, { cookie: admin, body: { password: `${u.email.split('@')[0]}2026` } })
    expect(own.status).toBe(422)
  })
})
