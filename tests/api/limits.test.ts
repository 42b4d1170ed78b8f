import { randomUUID } from 'node:crypto'
import http from 'node:http'
import { describe, expect, it } from 'vitest'
import { as, baseURL, call } from '../support/api'
import { testDb } from '../support/db'
import { addRun, newPlan, newVessel, sampleRun } from '../support/factories'
import { fire, readyRuns, registerVessel } from '../unit/bench/bench-api'

// Request size and shape limits: every body is bounded on the stream (chunked or not, whatever its Content-Type),
// foreign Host names are refused, plans have a ceiling of runs, and idempotency keys belong to their user.
interface RawReply { status: number, body: string, sentBytes: number }

/** Streams `totalBytes` as a chunked body (no Content-Length) until the server answers; raw http, no fetch buffering. */
function streamChunked(path: string, headers: Record<string, string>, totalBytes: number): Promise<RawReply> {
  const url = new URL(baseURL())
  return new Promise((resolve, reject) => {
    const req = http.request({ host: url.hostname, port: url.port, path, method: 'POST', agent: false, headers: { ...headers, 'transfer-encoding': 'chunked' } })
    let sent = 0
    let answered = false
    req.on('response', (res) => {
      answered = true
      let body = ''
      res.on('data', (d: Buffer) => { body += d.toString() })
      res.on('end', () => resolve({ status: res.statusCode ?? 0, body, sentBytes: sent }))
      res.on('error', reject)
    })
    req.on('error', (err) => { if (!answered) reject(Object.assign(err, { sentBytes: sent })) })
    const piece = Buffer.alloc(64 * 1024, 0x20)
    const pump = () => {
      while (!answered && sent < totalBytes) {
        sent += piece.length
        if (!req.write(piece)) {
          req.once('drain', pump)
          return
        }
      }
      if (!answered) req.end()
    }
    pump()
  })
}

function rawRequest(path: string, headers: Record<string, string>, method = 'GET'): Promise<{ status: number, body: string }> {
  const url = new URL(baseURL())
  return new Promise((resolve, reject) => {
    const req = http.request({ host: url.hostname, port: url.port, path, method, headers, agent: false }, (res) => {
      let body = ''
      res.on('data', (d: Buffer) => { body += d.toString() })
      res.on('end', () => resolve({ status: res.statusCode ?? 0, body }))
    })
    req.on('error', reject)
    req.end()
  })
}

describe('body limit', () => {
  it('refuses a chunked body without Content-Length past the ceiling with 413, before reading it all', async () => {
    // 200 kB sent in chunks: the whole body is on its way before the answer, so the answer is always read.
    const res = await streamChunked('/api/auth/login', { 'content-type': 'application/json' }, 200 * 1024)
    expect(res.status).toBe(413)
    expect(JSON.parse(res.body).message).toMatch(/larger than the 64 kB accepted/)
  })

  it('cuts off a 100 MB chunked sign-in body early and stays responsive', async () => {
    const streaming = streamChunked('/api/auth/login', { 'content-type': 'application/json' }, 100 * 1024 * 1024)
    streaming.catch(() => {}) // awaited below; this only keeps an early failure from counting as unhandled
    const health = await fetch(`${baseURL()}/api/health`)
    expect(health.status).toBe(200)
    // Either the sender reads the 413, or (Node closes a connection whose body was not read to the end) its next
    // write fails: in both cases only a little past the ceiling, plus socket buffers, was ever written.
    const res = await streaming.catch((err: Error & { sentBytes?: number, code?: string }) => ({ status: 0, body: '', sentBytes: err.sentBytes ?? Infinity, code: err.code }))
    if (res.status) expect(res.status).toBe(413)
    else expect(['EPIPE', 'ECONNRESET']).toContain((res as { code?: string }).code)
    expect(res.sentBytes).toBeLessThan(32 * 1024 * 1024)
    expect((await fetch(`${baseURL()}/api/health`)).status).toBe(200)
  })

  it('bounds a body whatever its Content-Type claims, multipart included, for any method', async () => {
    const cookie = await as('admin')
    const body = JSON.stringify({ name: 'x'.repeat(200 * 1024) })
    for (const type of ['application/json; x=multipart/form-data', 'multipart/form-data; boundary=abc', 'text/plain']) {
      for (const method of ['POST', 'PATCH', 'PUT', 'DELETE']) {
        const res = await call(method, '/api/vessels', { cookie, raw: body, headers: { 'content-type': type } })
        expect(res.status, `${method} ${type}`).toBe(413)
      }
    }
    const chunked = await streamChunked('/api/vessels', { 'content-type': 'multipart/form-data; boundary=abc', cookie }, 256 * 1024)
    expect(chunked.status).toBe(413)
    // The route's own larger ceiling applies to a plan import (1 MB of CSV), and a small body is read as before.
    const plan = await newPlan((await newVessel()).id)
    const csv = `sample_code,material,mass_g,heating_value_j_per_g,fuse_wire,fuse_length_cm\n${'A-1,,1.0,26454,nichrome,10\n'.repeat(8000)}`
    const big = await call('POST', `/api/plans/${plan.id}/import`, { cookie: await as('analyst'), body: { csv } })
    expect(big.status).not.toBe(413)
  })
})

describe('bodies the server never reads', () => {
  it('answers a body sent to a page, to an unknown route or with a GET, instead of waiting on it', async () => {
    const cookie = await as('admin')
    const body = { reason: 'try' }
    expect((await call('POST', '/api/nothing-here', { cookie, body })).status).toBe(404)
    expect((await call('POST', '/plans', { cookie, body })).status).toBeLessThan(500)
    const get = await rawRequest('/api/settings', { 'cookie': cookie, 'content-type': 'application/json', 'content-length': String(200 * 1024) })
    expect(get.status).toBe(413)
  })
})

describe('public origin', () => {
  it('refuses a request naming another Host with 421, and answers the configured one', async () => {
    const foreign = await rawRequest('/api/settings', { host: 'evil.example' })
    expect(foreign.status).toBe(421)
    expect(JSON.parse(foreign.body).message).toMatch(/answers for http:\/\/127\.0\.0\.1:\d+ only/)
    expect((await rawRequest('/login', { host: 'evil.example:80' })).status).toBe(421)
    const port = new URL(baseURL()).port
    // Loopback spellings of the configured origin are the same server.
    expect((await rawRequest('/api/settings', { host: `localhost:${port}` })).status).toBe(401)
    expect((await rawRequest('/api/settings', { host: `127.0.0.1:${port}` })).status).toBe(401)
    // A health probe may name the server by any address.
    expect((await rawRequest('/api/health', { host: '10.0.0.5' })).status).toBe(200)
  })
})

describe('runs per plan', () => {
  it('refuses a run, a duplicate or an import past the policy ceiling with 422 naming the field, and pages the plan', async () => {
    const admin = await as('admin')
    const set = await call('PATCH', '/api/settings', { cookie: admin, body: { policy: { maxRunsPerPlan: 3 }, reason: 'ceiling test (tests/api/limits.test.ts)' } })
    expect(set.status).toBe(200)
    try {
      const v = await newVessel()
      const plan = await newPlan(v.id)
      for (let i = 0; i < 3; i++) expect((await addRun(plan.id, sampleRun(0.5))).status).toBe(201)
      const fourth = await addRun(plan.id, sampleRun(0.5))
      expect(fourth.status).toBe(422)
      expect(fourth.body.data.fields[0]).toMatchObject({ path: 'runs', message: expect.stringMatching(/at most 3 per plan/) })
      const detail = await call('GET', `/api/plans/${plan.id}?runsOffset=1&runsLimit=1`, { cookie: await as('analyst') })
      expect(detail.body).toMatchObject({ runsTotal: 3, runsOffset: 1, draftCount: 3 })
      expect(detail.body.runs).toHaveLength(1)
      expect(detail.body.runs[0].seq).toBe(2)
      expect((await call('POST', `/api/runs/${detail.body.runs[0].id}/duplicate`, { cookie: await as('analyst'), body: {} })).status).toBe(422)
      const other = await newPlan(v.id)
      const csv = `sample_code,material,mass_g,heating_value_j_per_g,fuse_wire,fuse_length_cm\n${'B-1,,1.0,26454,nichrome,10\n'.repeat(4)}`
      const imported = await call('POST', `/api/plans/${other.id}/import`, { cookie: await as('analyst'), body: { csv, commit: true } })
      expect(imported.status).toBe(422)
      expect(imported.body.data.fields[0].path).toBe('csv')
      const { rows } = await testDb().query('select count(*)::int as n from runs where plan_id = $1', [other.id])
      expect(rows[0].n).toBe(0)
    }
    finally {
      await call('PATCH', '/api/settings', { cookie: admin, body: { policy: { maxRunsPerPlan: 300 }, reason: 'ceiling test done' } })
    }
  })
})

describe('idempotency keys', () => {
  it('belong to the user who sent them: the same key from another analyst fires another run', async () => {
    const v = await registerVessel()
    const [a] = await readyRuns(v.id, [{ massG: 0.8 }])
    const [b] = await readyRuns(v.id, [{ massG: 0.8 }], await as('analyst2'))
    const key = randomUUID()
    expect((await fire(a!.id, { weighedMassG: 0.8 }, { key })).status).toBe(201)
    const other = await fire(b!.id, { weighedMassG: 0.8 }, { key, cookie: await as('analyst2') })
    expect(other.status).toBe(201)
    expect(other.headers.get('idempotent-replayed')).toBeNull()
    expect(other.body.run.id).toBe(b!.id)
  })
})
