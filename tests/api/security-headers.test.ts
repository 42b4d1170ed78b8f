// Security headers on every kind of answer (OWASP ASVS 4.0.3 V14.4 "HTTP Security Headers" as the yardstick):
// pages, JSON, errors, downloads and static assets. CSP directives as defined by CSP Level 3 (W3C); HSTS by RFC 6797.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { as, baseURL, call, unique } from '../support/api'
import { startServer } from '../support/server-process'
import type { ServerProcess } from '../support/server-process'

async function get(path: string, headers: Record<string, string> = {}) {
  const res = await fetch(baseURL() + path, { headers, redirect: 'manual' })
  return { res, text: await res.text() }
}

/** The CSP as a map of directive → sources. */
function csp(h: Headers): Map<string, string[]> {
  const value = h.get('content-security-policy')
  expect(value, 'Content-Security-Policy header').toBeTruthy()
  return new Map(value!.split(';').map(d => d.trim()).filter(Boolean).map((d) => {
    const [name, ...sources] = d.split(/\s+/)
    return [name!.toLowerCase(), sources]
  }))
}

/** What every answer carries, whatever its kind. */
function expectBaseline(h: Headers, what: string) {
  const policy = csp(h)
  expect(policy.get('frame-ancestors'), `${what}: frame-ancestors`).toEqual(['\'none\''])
  expect(h.get('x-content-type-options'), `${what}: nosniff`).toBe('nosniff')
  expect(h.get('referrer-policy'), `${what}: Referrer-Policy`).toMatch(/^(same-origin|no-referrer|strict-origin-when-cross-origin)$/)
  expect(h.get('permissions-policy'), `${what}: Permissions-Policy`).toMatch(/camera=\(\)/)
  expect(h.get('permissions-policy')).toMatch(/geolocation=\(\)/)
  expect(h.get('cross-origin-opener-policy'), `${what}: COOP`).toBe('same-origin')
  expect(h.get('x-powered-by'), `${what}: no X-Powered-By`).toBeNull()
  // Plain HTTP: no HSTS (a browser must ignore it there anyway, RFC 6797 §8.1).
  expect(h.get('strict-transport-security'), `${what}: no HSTS over http`).toBeNull()
  const script = policy.get('script-src') ?? policy.get('default-src') ?? []
  expect(script, `${what}: no inline scripts`).not.toContain('\'unsafe-inline\'')
  expect(script).not.toContain('\'unsafe-eval\'')
}

describe('security headers', () => {
  it('gives each rendered page a fresh nonce, and only scripts with that nonce run', async () => {
    const a = await get('/login')
    const b = await get('/login')
    expect(a.res.status).toBe(200)
    expectBaseline(a.res.headers, 'sign-in page')
    const policy = csp(a.res.headers)
    const nonce = policy.get('script-src')!.find(s => s.startsWith('\'nonce-'))?.slice(7, -1)
    expect(nonce, 'a nonce in script-src').toMatch(/^[\w+/=-]{16,}$/)
    expect(policy.get('script-src')).toContain('\'strict-dynamic\'')
    expect(policy.get('script-src-attr')).toEqual(['\'none\''])
    expect(policy.get('object-src')).toEqual(['\'none\''])
    expect(policy.get('base-uri')).toEqual(['\'none\''])
    expect(policy.get('default-src')).toEqual(['\'none\''])
    // Every script tag Nuxt wrote (the module entry, the inline config, the payload) carries this response's nonce.
    const tags = a.text.match(/<script\b[^>]*>/g) ?? []
    expect(tags.length).toBeGreaterThanOrEqual(2)
    for (const tag of tags) expect(tag, tag).toContain(`nonce="${nonce}"`)
    // A nonce is used once: the next answer has another one.
    const other = csp(b.res.headers).get('script-src')!.find(s => s.startsWith('\'nonce-'))
    expect(other).not.toBe(`'nonce-${nonce}'`)
  })

  it('sends them with a signed-in page, JSON answers, errors, downloads and static assets', async () => {
    const cookie = await as('analyst')
    const page = await get('/vessels', { cookie })
    expect(page.res.status).toBe(200)
    expectBaseline(page.res.headers, 'vessels page')

    const json = await call('GET', '/api/vessels', { cookie })
    expect(json.status).toBe(200)
    expectBaseline(json.headers, 'GET /api/vessels')
    // Nothing in a JSON answer may load or run anything.
    expect(csp(json.headers).get('default-src')).toEqual(['\'none\''])

    const answers = [['/api/health', 200, false], ['/api/vessels', 401, false], ['/api/no-such-route', 404, true], ['/no-such-page', 404, true], ['/no-such-page', 302, false]] as const
    for (const [path, status, signedIn] of answers) {
      const res = await get(path, signedIn ? { cookie } : {})
      expect(res.res.status, path).toBe(status)
      expectBaseline(res.res.headers, `${status} ${path}`)
    }

    const csv = await fetch(`${baseURL()}/api/plans/import-template.csv`, { headers: { cookie } })
    expect(csv.status).toBe(200)
    expectBaseline(csv.headers, 'CSV download')

    // Static files: the module entry named in the page, and the icon.
    const entry = page.text.match(/<script[^>]+src="([^"]+\.js)"/)?.[1]
    expect(entry).toBeTruthy()
    for (const path of [entry!, '/favicon.svg']) {
      const res = await get(path)
      expect(res.res.status, path).toBe(200)
      expectBaseline(res.res.headers, path)
    }
  })

  it('keeps framing forbidden on an attachment that sets its own sandboxed CSP', async () => {
    const admin = await as('admin')
    const vessel = await call('POST', '/api/vessels', { cookie: admin, body: { name: unique('Hdr'), serialNumber: unique('SN'), class: 'standard', ratedEnergyJ: 33000, maxChargeMassG: 1.5, maxFillPressureMPa: 4.05, volumeMl: 300 } })
    expect(vessel.status).toBe(201)
    // PNG signature (ISO/IEC 15948 §5.2) followed by filler.
    const png = Buffer.concat([Buffer.from([0x89, 0x50, 0x4E, 0x47, 0x0D, 0x0A, 0x1A, 0x0A]), Buffer.from('IHDR header test')])
    const form = new FormData()
    form.append('files', new Blob([new Uint8Array(png)], { type: 'image/png' }), 'face.png')
    const technician = await as('technician')
    const up = await fetch(`${baseURL()}/api/vessels/${vessel.body.id}/attachments`, { method: 'POST', body: form, headers: { cookie: technician } })
    expect(up.status).toBe(201)
    const [file] = await up.json() as { id: string }[]
    const res = await get(`/api/attachments/${file!.id}`, { cookie: technician })
    expect(res.res.status).toBe(200)
    expectBaseline(res.res.headers, 'attachment')
    expect(res.res.headers.get('content-security-policy')).toMatch(/sandbox/)
    // A private file: never stored by a browser or proxy.
    expect(res.res.headers.get('cache-control')).toBe('no-store')
  })

  it('never sends HSTS because a client claims X-Forwarded-Proto: https without a trusted proxy', async () => {
    for (const path of ['/login', '/api/health', '/favicon.svg']) {
      const claimed = await get(path, { 'x-forwarded-proto': 'https' })
      expect(claimed.res.headers.get('strict-transport-security'), path).toBeNull()
    }
  })

  describe('behind a trusted TLS-terminating proxy (EMBERLINE_TRUST_PROXY=1)', () => {
    let server: ServerProcess
    beforeAll(async () => { server = await startServer({ EMBERLINE_TRUST_PROXY: '1', EMBERLINE_REMINDERS: 'off' }) })
    afterAll(async () => { await server?.stop() })

    it('sends HSTS when the proxy says the request came over HTTPS, never over plain HTTP', async () => {
      for (const path of ['/login', '/api/health', '/favicon.svg']) {
        const https = await fetch(server.baseURL + path, { headers: { 'x-forwarded-proto': 'https' }, redirect: 'manual' })
        // RFC 6797 §6.1: max-age in seconds; one year here.
        expect(https.headers.get('strict-transport-security'), path).toBe('max-age=31536000; includeSubDomains')
        const http = await fetch(server.baseURL + path, { redirect: 'manual' })
        expect(http.headers.get('strict-transport-security'), path).toBeNull()
      }
    })
  })

  it('marks every answer that depends on who asks Cache-Control: no-store; built assets keep long caching', async () => {
    const admin = await as('admin')
    for (const path of ['/api/audit', '/api/admin/users', '/api/admin/mail', '/api/settings', '/api/fleet', '/api/account/sessions']) {
      const res = await call('GET', path, { cookie: admin })
      expect(res.status, path).toBe(200)
      expect(res.headers.get('cache-control'), path).toBe('no-store')
    }
    const page = await fetch(`${baseURL()}/admin/users`, { headers: { cookie: admin } })
    expect(page.headers.get('cache-control')).toBe('no-store')
    const html = await page.text()
    const asset = html.match(/\/_nuxt\/[\w.-]+\.js/)?.[0]
    expect(asset, 'a built script named in the page').toBeTruthy()
    const cached = await fetch(baseURL() + asset!)
    expect(cached.status).toBe(200)
    expect(cached.headers.get('cache-control')).toMatch(/max-age=\d{5,}/)
  })

  it('refuses an oversized JSON body with 413 before reading it, yet lets an upload within the lab policy through', async () => {
    const cookie = await as('admin')
    const huge = JSON.stringify({ name: 'x'.repeat(5 * 1024 * 1024) })
    const res = await call('POST', '/api/vessels', { cookie, raw: huge, headers: { 'content-type': 'application/json' } })
    expect(res.status).toBe(413)
    expect(res.body.message).toMatch(/larger than the 64 kB accepted/)

    const vessel = await call('POST', '/api/vessels', { cookie, body: { name: unique('Big'), serialNumber: unique('SN'), class: 'standard', ratedEnergyJ: 33000, maxChargeMassG: 1.5, maxFillPressureMPa: 4.05, volumeMl: 300 } })
    // A 9.5 MB photo: under the policy's 10 MiB per file (shared/domain/policy.ts), far over the 64 kB JSON limit.
    const big = Buffer.alloc(9.5 * 1024 * 1024, 0x20)
    big.set([0x89, 0x50, 0x4E, 0x47, 0x0D, 0x0A, 0x1A, 0x0A], 0)
    const form = new FormData()
    form.append('files', new Blob([new Uint8Array(big)], { type: 'image/png' }), 'large.png')
    const up = await fetch(`${baseURL()}/api/vessels/${vessel.body.id}/attachments`, { method: 'POST', body: form, headers: { cookie: await as('technician') } })
    expect(up.status).toBe(201)
    expect((await up.json() as { sizeBytes: number }[])[0]!.sizeBytes).toBe(big.length)
  })
})
