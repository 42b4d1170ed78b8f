// The database goes away for a few seconds. A second server instance talks to the test database through a
// TCP proxy written here, so the test can cut the line without owning the PostgreSQL cluster: while it is cut every
// API request answers a clean 503, a write is never half-applied, and the server recovers by itself once it returns.
import net from 'node:net'
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest'
import { unique } from '../support/api'
import { testDb } from '../support/db'
import { startServer, type ServerProcess } from '../support/server-process'

const OUTAGE_MESSAGE = 'The database is not reachable right now; nothing was saved. Try again in a moment.'

type Mode = 'open' | 'refuse' | 'blackhole' | 'cut-at-commit'

/**
 * A TCP proxy in front of PostgreSQL. `refuse`: connections are reset and new ones refused (a restart);
 * `blackhole`: new connections are accepted and never answered (a network partition);
 * `cut-at-commit`: a connection is cut the moment its client sends COMMIT (the server then rolls the transaction back).
 */
class PgProxy {
  mode: Mode = 'open'
  port = 0
  commitsCut = 0
  private server: net.Server | null = null
  private sockets = new Set<net.Socket>()

  constructor(private target: { host: string, port: number }) {}

  async listen(port = 0) {
    this.server = net.createServer(client => this.accept(client))
    await new Promise<void>((resolve, reject) => {
      this.server!.once('error', reject)
      this.server!.listen(port, '127.0.0.1', () => resolve())
    })
    this.port = (this.server!.address() as net.AddressInfo).port
  }

  private track(s: net.Socket) {
    this.sockets.add(s)
    s.on('close', () => this.sockets.delete(s))
    s.on('error', () => s.destroy())
  }

  private accept(client: net.Socket) {
    this.track(client)
    if (this.mode === 'blackhole') return
    const upstream = net.connect(this.target.port, this.target.host)
    this.track(upstream)
    upstream.on('data', d => client.write(d))
    client.on('data', (d: Buffer) => {
      // A simple or extended-protocol query whose text is COMMIT ends with "commit" and a NUL (PostgreSQL protocol §55.7).
      if (this.mode === 'cut-at-commit' && d.toString('latin1').toLowerCase().includes('commit\0')) {
        this.commitsCut++
        client.destroy()
        upstream.destroy()
        return
      }
      upstream.write(d)
    })
    client.on('close', () => upstream.destroy())
    upstream.on('close', () => client.destroy())
  }

  /** Drops every open connection (the server side sees them end). */
  dropAll() {
    for (const s of this.sockets) s.destroy()
  }

  async set(mode: Mode) {
    this.mode = mode
    if (mode === 'refuse') {
      this.dropAll()
      await new Promise<void>(resolve => (this.server ? this.server.close(() => resolve()) : resolve()))
      this.server = null
    }
    else if (!this.server) {
      await this.listen(this.port)
    }
    if (mode === 'blackhole') this.dropAll()
  }

  async close() {
    this.dropAll()
    await new Promise<void>(resolve => (this.server ? this.server.close(() => resolve()) : resolve()))
  }
}

describe('database outage', () => {
  let proxy: PgProxy
  let server: ServerProcess
  let cookie = ''

  async function request(method: string, path: string, body?: unknown) {
    // A bound on the wait, so that a hang shows as a failure rather than a stuck test.
    const res = await fetch(server.baseURL + path, {
      method,
      headers: { 'cookie': cookie, ...(body ? { 'content-type': 'application/json' } : {}) },
      body: body ? JSON.stringify(body) : undefined,
      signal: AbortSignal.timeout(20_000),
    })
    const text = await res.text()
    let json: any = null
    try { json = JSON.parse(text) }
    catch { /* not JSON */ }
    return { status: res.status, headers: res.headers, body: json, text }
  }

  /** Retries until the server answers 200 again: the pool must replace its dead connections by itself. */
  function recovered(path = '/api/vessels') {
    return vi.waitFor(async () => {
      const res = await request('GET', path)
      if (res.status !== 200) throw new Error(`no recovery: ${res.status} ${res.text}`)
      return res
    }, { timeout: 30_000, interval: 250 })
  }

  const vesselBody = () => ({ name: unique('Outage'), serialNumber: unique('SN'), class: 'standard', ratedEnergyJ: 33000, maxChargeMassG: 1.5, maxFillPressureMPa: 4.05, volumeMl: 300 })
  const count = async (sql: string, params: unknown[] = []) => Number((await testDb().query(sql, params)).rows[0].n)

  function expectOutage(res: Awaited<ReturnType<typeof request>>, what: string) {
    expect(res.status, `${what}: ${res.text.slice(0, 300)}`).toBe(503)
    expect(res.body).toMatchObject({ statusCode: 503, message: OUTAGE_MESSAGE })
    expect(res.body.data.requestId).toMatch(/^[0-9a-f-]{36}$/)
    expect(res.headers.get('retry-after')).toBe('5')
    // No stack trace, no SQL, no driver detail.
    expect(res.text).not.toMatch(/\bat \w|node_modules|select |insert |ECONN/i)
  }

  beforeAll(async () => {
    const url = new URL(process.env.NUXT_DATABASE_URL!)
    proxy = new PgProxy({ host: url.hostname, port: Number(url.port || 5432) })
    await proxy.listen()
    url.hostname = '127.0.0.1'
    url.port = String(proxy.port)
    // Scheduled reminders off: the test watches request answers; the pool under test is the requests' pool.
    server = await startServer({ NUXT_DATABASE_URL: url.toString(), EMBERLINE_REMINDERS: 'off' })
    const login = await fetch(`${server.baseURL}/api/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email: 'admin@emberline.test', password: 'ember-demo-2026' }) })
    expect(login.status).toBe(200)
    cookie = login.headers.getSetCookie().find(c => c.startsWith('emberline-session='))!.split(';')[0]!
  })
  afterAll(async () => {
    await server?.stop()
    await proxy?.close()
  })

  it('answers 503 to reads, writes and sign-in while the database is down, then recovers by itself', async () => {
    expect((await request('GET', '/api/vessels')).status).toBe(200)
    const vessels = await count('select count(*)::int as n from vessels')
    const audits = await count('select count(*)::int as n from audit_log')

    await proxy.set('refuse')
    expectOutage(await request('GET', '/api/vessels'), 'GET /api/vessels')
    const body = vesselBody()
    expectOutage(await request('POST', '/api/vessels', body), 'POST /api/vessels')
    const login = await fetch(`${server.baseURL}/api/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email: 'analyst@emberline.test', password: 'ember-demo-2026' }) })
    expect(login.status).toBe(503)
    // The readiness probe says so too (a load balancer takes the instance out meanwhile).
    expect((await request('GET', '/api/health')).status).toBe(503)
    // The process is still there and still answers.
    expectOutage(await request('GET', '/api/fleet'), 'GET /api/fleet')

    await proxy.set('open')
    await recovered()
    // Nothing from the outage was written; the same write now succeeds, once.
    expect(await count('select count(*)::int as n from vessels where name = $1', [body.name])).toBe(0)
    const again = await request('POST', '/api/vessels', body)
    expect(again.status).toBe(201)
    expect(await count('select count(*)::int as n from vessels')).toBe(vessels + 1)
    expect(await count('select count(*)::int as n from audit_log where action = \'vessel.register\' and entity_id = $1', [again.body.id])).toBe(1)
    expect(await count('select count(*)::int as n from audit_log')).toBeGreaterThan(audits)
  })

  it('answers 503 within the pool\'s connection timeout when the network swallows connections, and recovers', async () => {
    await recovered()
    await proxy.set('blackhole')
    // server/utils/db.ts: connectionTimeoutMillis 5 000 ms; the request's own bound is 20 s.
    expectOutage(await request('GET', '/api/vessels'), 'GET during a partition')
    await proxy.set('open')
    await recovered()
  })

  it('never half-applies a write whose connection is lost at COMMIT: the vessel and its audit row are both absent', async () => {
    await recovered()
    const vessels = await count('select count(*)::int as n from vessels')
    const registrations = await count('select count(*)::int as n from audit_log where action = \'vessel.register\'')
    await proxy.set('cut-at-commit')
    const body = vesselBody()
    const res = await request('POST', '/api/vessels', body)
    expectOutage(res, 'POST cut at COMMIT')
    expect(proxy.commitsCut).toBeGreaterThanOrEqual(1)
    await proxy.set('open')
    await recovered()
    // PostgreSQL rolls back a transaction whose connection ends before COMMIT: neither the row nor its audit entry exists.
    expect(await count('select count(*)::int as n from vessels')).toBe(vessels)
    expect(await count('select count(*)::int as n from vessels where name = $1', [body.name])).toBe(0)
    expect(await count('select count(*)::int as n from audit_log where action = \'vessel.register\'')).toBe(registrations)
    // Retried after the outage, it is written exactly once.
    expect((await request('POST', '/api/vessels', body)).status).toBe(201)
    expect(await count('select count(*)::int as n from vessels where name = $1', [body.name])).toBe(1)
  })

  it('logs the outage on the server without crashing it', () => {
    expect(server.output()).toMatch(/\[db\] unreachable, answering 503/)
    expect(server.output()).not.toMatch(/Unhandled|uncaught/i)
  })
})
