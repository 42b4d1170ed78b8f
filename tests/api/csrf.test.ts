// Cross-site request protection (OWASP ASVS 4.0.3 V4.2.2, OWASP CSRF Prevention Cheat Sheet: "verifying
// origin with standard headers" and Fetch Metadata). A browser sends Origin on every cross-origin POST/PUT/PATCH/DELETE
// (Fetch Standard §3.1) and Sec-Fetch-Site on every request (W3C Fetch Metadata).
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { as, baseURL, call, unique } from '../support/api'
import { auditRows, testDb } from '../support/db'
import { startServer, type ServerProcess } from '../support/server-process'

const vesselBody = () => ({ name: unique('Csrf'), serialNumber: unique('SN'), class: 'standard', ratedEnergyJ: 33000, maxChargeMassG: 1.5, maxFillPressureMPa: 4.05, volumeMl: 300 })
const vesselsNamed = async (name: string) => Number((await testDb().query('select count(*)::int as n from vessels where name = $1', [name])).rows[0].n)
const own = () => new URL(baseURL()).origin

describe('cross-site request protection', () => {
  it('refuses a change posted from another origin with 403, and changes nothing', async () => {
    const admin = await as('admin')
    const since = new Date()
    // Another port or scheme of loopback is another origin; localhost and 127.0.0.1 on the configured port are the
    // same server (NUXT_PUBLIC_SITE_URL on loopback accepts every loopback spelling of its port).
    const otherPort = own().replace(/:(\d+)$/, (_, p: string) => `:${Number(p) + 1}`)
    for (const origin of ['https://evil.example', 'null', otherPort, otherPort.replace('127.0.0.1', 'localhost'), own().replace('http:', 'https:')]) {
      const body = vesselBody()
      const res = await call('POST', '/api/vessels', { cookie: admin, body, headers: { origin } })
      expect(res.status, origin).toBe(403)
      expect(res.body.message).toMatch(/another site/)
      expect(await vesselsNamed(body.name)).toBe(0)
    }
    expect(await auditRows({ action: 'vessel.register', since })).toHaveLength(0)
  })

  it('refuses what the browser marks as cross-site even without an Origin header', async () => {
    const body = vesselBody()
    const res = await call('POST', '/api/vessels', { cookie: await as('admin'), body, headers: { 'sec-fetch-site': 'cross-site' } })
    expect(res.status).toBe(403)
    expect(await vesselsNamed(body.name)).toBe(0)
  })

  it('guards every changing method, sign-in and sign-out included, but never a read', async () => {
    const evil = { origin: 'https://evil.example', 'sec-fetch-site': 'cross-site' }
    const admin = await as('admin')
    const vessel = await call('POST', '/api/vessels', { cookie: admin, body: vesselBody() })
    expect(vessel.status).toBe(201)
    const patch = await call('PATCH', `/api/vessels/${vessel.body.id}`, { cookie: admin, body: { notes: 'changed from elsewhere' }, headers: evil })
    expect(patch.status).toBe(403)
    expect((await testDb().query('select notes from vessels where id = $1', [vessel.body.id])).rows[0].notes).toBe('')
    // Sign-in from another site (login CSRF) and sign-out from another site are refused too.
    const login = await call('POST', '/api/auth/login', { body: { email: 'analyst@emberline.test', password: 'ember-demo-2026' }, headers: evil })
    expect(login.status).toBe(403)
    expect(login.headers.getSetCookie().some(c => c.startsWith('emberline-session='))).toBe(false)
    expect((await call('DELETE', '/api/_auth/session', { cookie: admin, headers: evil })).status).toBe(403)
    expect((await call('POST', '/api/auth/logout', { cookie: admin, headers: evil })).status).toBe(403)
    // The session still works: nothing was signed out.
    expect((await call('GET', '/api/vessels', { cookie: admin })).status).toBe(200)
    // Reads are not changes: a link from another site still opens (SameSite=Lax sends the cookie on top-level GETs).
    expect((await call('GET', `/api/vessels/${vessel.body.id}`, { cookie: admin, headers: evil })).status).toBe(200)
  })

  it('lets the app\'s own pages through (same Origin, same-origin fetch metadata) and callers that send neither', async () => {
    const admin = await as('admin')
    const a = vesselBody()
    const same = await call('POST', '/api/vessels', { cookie: admin, body: a, headers: { 'origin': own(), 'sec-fetch-site': 'same-origin' } })
    expect(same.status).toBe(201)
    expect(await vesselsNamed(a.name)).toBe(1)
    const b = vesselBody()
    expect((await call('POST', '/api/vessels', { cookie: admin, body: b })).status).toBe(201)
    expect(await vesselsNamed(b.name)).toBe(1)
  })

  it('does not trust forwarded host or scheme headers unless told to', async () => {
    const body = vesselBody()
    const res = await call('POST', '/api/vessels', {
      cookie: await as('admin'),
      body,
      headers: { 'origin': 'https://evil.example', 'x-forwarded-host': 'evil.example', 'x-forwarded-proto': 'https' },
    })
    expect(res.status).toBe(403)
    expect(await vesselsNamed(body.name)).toBe(0)
  })

  describe('behind a trusted reverse proxy (EMBERLINE_TRUST_PROXY=1)', () => {
    let server: ServerProcess
    beforeAll(async () => { server = await startServer({ EMBERLINE_TRUST_PROXY: '1', EMBERLINE_REMINDERS: 'off', NUXT_PUBLIC_SITE_URL: 'https://lab.example' }) })
    afterAll(async () => { await server?.stop() })

    async function post(path: string, body: unknown, headers: Record<string, string>) {
      const res = await fetch(server.baseURL + path, { method: 'POST', body: JSON.stringify(body), headers: { 'content-type': 'application/json', ...headers } })
      return { status: res.status, headers: res.headers, body: await res.json().catch(() => null) as any }
    }

    it('compares Origin with the host and scheme the proxy forwards', async () => {
      const forwarded = { 'x-forwarded-host': 'lab.example', 'x-forwarded-proto': 'https' }
      const login = await post('/api/auth/login', { email: 'admin@emberline.test', password: 'ember-demo-2026' }, { ...forwarded, origin: 'https://lab.example' })
      expect(login.status).toBe(200)
      const cookie = login.headers.getSetCookie().find(c => c.startsWith('emberline-session='))!.split(';')[0]!
      const good = vesselBody()
      expect((await post('/api/vessels', good, { ...forwarded, cookie, origin: 'https://lab.example' })).status).toBe(201)
      expect(await vesselsNamed(good.name)).toBe(1)
      const bad = vesselBody()
      expect((await post('/api/vessels', bad, { ...forwarded, cookie, origin: 'https://evil.example' })).status).toBe(403)
      // The proxy serves HTTPS: the same host over plain HTTP is another origin.
      expect((await post('/api/vessels', bad, { ...forwarded, cookie, origin: 'http://lab.example' })).status).toBe(403)
      expect(await vesselsNamed(bad.name)).toBe(0)
    })
  })
})
