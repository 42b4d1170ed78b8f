import { randomUUID } from 'node:crypto'
import { beforeAll, describe, expect, it } from 'vitest'
import { as, baseURL, call } from '../support/api'
import type { DemoRole } from '../support/api'
import { testDb } from '../support/db'
import { MATRIX } from '../support/roles-matrix'
import { apiRoutes } from '../support/routes'
import { benzoicAcidId, enterResult, fire, readyRuns, registerVessel } from '../unit/bench/bench-api'

// Every mutating route: thousands of malformed, oversized, wrongly typed and hostile requests,
// sent as a role allowed to call the route, at real records and at random ids → always a 4xx with a JSON message, never
// a 5xx, and the domain tables exactly as they were (a checksum of each table before and after each route).
// The generator is seeded, so a failure repeats exactly.

/** mulberry32: small, seedable pseudo-random numbers in [0, 1). */
function seeded(seed: number): () => number {
  let a = seed >>> 0
  return () => {
    a = (a + 0x6D2B79F5) >>> 0
    let t = a
    t = Math.imul(t ^ (t >>> 15), t | 1)
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61)
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296
  }
}

const SEED = 20261201
const PER_ROUTE = 200
const CONCURRENCY = 8
const SAMPLE_ID = '00000000-0000-4000-8000-000000000000'

// Body-less routes tell nothing under body fuzzing: logout would end the shared session, and the fleet check ignores
// any body (it is refused to the wrong roles in route-matrix.test.ts and checked in reminders.test.ts).
// "Sign out everywhere else" takes no body and writes its audit row at each call.
const SKIP = new Set(['POST /api/auth/logout', 'POST /api/admin/reminders/run', 'POST /api/account/sign-out-others'])
// These ignore the body and act on the id alone, so a real id would rightly succeed: they get random ids only.
const RANDOM_IDS_ONLY = new Set(['POST /api/admin/users/[id]/sign-out', 'POST /api/runs/[id]/duplicate', 'POST /api/account/sessions/[id]/end'])

// One field each route knows, given a value no schema field accepts (arrays nested in arrays), so that no generated
// object body can be valid by chance (a body whose fields are all optional would otherwise change the record).
const POISON: Record<string, string> = {
  'POST /api/auth/login': 'email',
  'POST /api/account/password': 'newPassword',
  'PATCH /api/settings': 'reason',
  'POST /api/assess': 'components',
  'POST /api/aid-values': 'determinationsJPerG',
  'POST /api/admin/users': 'email',
  'PATCH /api/admin/users/[id]': 'name',
  'POST /api/admin/users/[id]/password': 'password',
  'POST /api/materials': 'name',
  'PATCH /api/materials/[id]': 'reason',
  'POST /api/plans': 'name',
  'POST /api/plans/[id]/import': 'csv',
  'POST /api/plans/[id]/runs': 'sampleCode',
  'POST /api/reports': 'sampleCode',
  'POST /api/results/[id]/revise': 'reason',
  'POST /api/results/[id]/sign': 'password',
  'PATCH /api/runs/[id]': 'sampleCode',
  'POST /api/runs/[id]/approve': 'password',
  'POST /api/runs/[id]/reject': 'password',
  'POST /api/runs/[id]/withdraw': 'reason',
  'POST /api/runs/[id]/firing': 'outcome',
  'POST /api/runs/[id]/result': 'temperatureRiseK',
  'POST /api/vessels': 'name',
  'PATCH /api/vessels/[id]': 'name',
  'POST /api/vessels/[id]/energy-equivalent': 'resultIds',
  'POST /api/vessels/[id]/services': 'kind',
  'POST /api/clients': 'name',
  'POST /api/samples': 'description',
  'POST /api/samples/[id]/reject': 'reason',
  'POST /api/plans/[id]/from-samples': 'sampleIds',
  'POST /api/day-plans/proposal': 'vesselIds',
  'POST /api/day-plans': 'vesselIds',
}

const DOMAIN_TABLES = ['users', 'vessels', 'materials', 'plans', 'runs', 'signatures', 'firings', 'services', 'results', 'energy_equivalents',
  'reports', 'lab_settings', 'attachments', 'clients', 'samples', 'day_plans', 'aid_values']
// A refused sign-in is itself recorded (login_attempts and its audit row: the lockout and the trail depend on it),
// so these are compared for every route but the login route. captured_mail is left out: the fake mail server fills
// it from mail queued by earlier test files whenever the outbox worker gets to it; the outbox itself is compared.
const TRAIL_TABLES = ['audit_log', 'login_attempts', 'mail_outbox']

async function checksums(tables: string[]) {
  const out: Record<string, string> = {}
  for (const t of tables) {
    // The outbox worker marks queued mail sent in the background; only which mail is queued must not change.
    const cols = t === 'mail_outbox' ? 'x.id::text' : 'x::text'
    const { rows } = await testDb().query(`select md5(coalesce(string_agg(${cols}, ',' order by ${cols}), '')) as sum from ${t} x`)
    out[t] = rows[0].sum
  }
  return out
}

const NASTY_STRINGS = ['', ' ', 'NaN', 'Infinity', '-Infinity', '1e309', '-0', '0x1F', 'null', 'true', '\'; drop table runs; --', '1 OR 1=1',
  '<script>alert(1)</script>', '<img src=x onerror=alert(1)>', '${7*7}', '../../etc/passwd', '\u0000', '\uFFFF', '𝔈𝔪𝔟𝔢𝔯', '__proto__', 'constructor',
  'not-a-uuid', SAMPLE_ID, '2026-13-45', 'complete', 'nobody@emberline.test', 'é'.repeat(300)]
const NASTY_NUMBERS = [0, -0, -1, 1e-300, 1e300, Number.MAX_VALUE, -Number.MAX_VALUE, Number.MAX_SAFE_INTEGER, 2 ** 53 + 1, 0.5, 3, 1e7]
const KEYS = ['name', 'email', 'password', 'roles', 'active', 'reason', 'labName', 'policy', 'csv', 'commit', 'outcome', 'weighedMassG', 'aidMassG',
  'observations', 'sampleCode', 'kind', 'components', 'fillPressureMPa', 'vesselId', 'serialNumber', 'class', 'ratedEnergyJ', 'maxChargeMassG',
  'volumeMl', 'temperatureRiseK', 'fuse', 'resultIds', 'meaning', 'chargeHash', 'heatingValueJPerG', 'formula', 'note', '__proto__', 'constructor', 'prototype']
const HUGE = 'A'.repeat(100_000)

type Json = null | boolean | number | string | Json[] | { [key: string]: Json }
interface Attempt { contentType?: string, raw: string, what: string }

function generator(rand: () => number, poisonKey: string | undefined) {
  const pick = <T>(list: readonly T[]): T => list[Math.floor(rand() * list.length)]!
  const deep = (depth: number): Json => (depth === 0 ? pick(NASTY_STRINGS) : rand() < 0.5 ? [deep(depth - 1)] : { [pick(KEYS)]: deep(depth - 1) })
  const poison = (): Json => [[[pick(NASTY_STRINGS)], [pick(NASTY_NUMBERS)]]]
  function value(depth = 0): Json {
    const r = rand()
    if (r < 0.25) return pick(NASTY_NUMBERS)
    if (r < 0.5) return pick(NASTY_STRINGS)
    if (r < 0.55) return rand() < 0.5
    if (r < 0.6) return null
    if (r < 0.63) return HUGE
    if (r < 0.75 && depth < 3) return Array.from({ length: Math.floor(rand() * 4) }, () => value(depth + 1))
    if (r < 0.9 && depth < 3) return object(depth + 1)
    return pick(NASTY_STRINGS)
  }
  function object(depth = 0): { [key: string]: Json } {
    return Object.fromEntries(Array.from({ length: Math.floor(rand() * 5) }, () => [pick(KEYS), value(depth)]))
  }
  /** A JSON object body whose route field carries the poison, written as text so __proto__ keys arrive as keys. */
  function poisoned(extra: { [key: string]: Json }): string {
    // A repeated key would replace the poison (JSON keeps the last one), so the extra fields never repeat it.
    const body = Object.fromEntries(Object.entries(extra).filter(([k]) => k !== poisonKey))
    const text = JSON.stringify(body)
    const pairs = `"${poisonKey ?? 'x'}":${JSON.stringify(poison())}`
    return text === '{}' ? `{${pairs}}` : `{${pairs},${text.slice(1)}`
  }
  return (): Attempt => {
    const r = rand()
    if (r < 0.45) return { contentType: 'application/json', raw: poisoned(object()), what: 'object' }
    if (r < 0.55) return { contentType: 'application/json', raw: `{"${pick(['__proto__', 'constructor'])}":{"polluted":true},${poisoned(object()).slice(1)}`, what: 'prototype keys' }
    if (r < 0.62) return { contentType: 'application/json', raw: JSON.stringify(deep(200)), what: 'nesting 200 levels' }
    if (r < 0.68) return { contentType: 'application/json', raw: JSON.stringify(Array.from({ length: 1 + Math.floor(rand() * 3) }, () => object())), what: 'array for object' }
    if (r < 0.74) return { contentType: 'application/json', raw: pick(['1e309', 'NaN', 'Infinity', '-0', '"text"', 'null', 'true', '42', '[]']), what: 'scalar' }
    if (r < 0.8) return { contentType: 'application/json', raw: pick(['{', '{"a":', '{"a":1,}', '{\'a\':1}', '\u0000', '{"a":NaN}', '{"a":1e309}', '{"a":-0}']), what: 'broken JSON' }
    if (r < 0.84) return { contentType: 'application/json', raw: poisoned({ [pick(KEYS)]: HUGE + HUGE }), what: '200 kB string' }
    if (r < 0.9) return { contentType: 'text/plain', raw: poisoned(object()), what: 'text/plain' }
    if (r < 0.95) return { contentType: 'application/x-www-form-urlencoded', raw: `${poisonKey ?? 'x'}[]=1&${pick(KEYS.filter(k => k !== poisonKey))}=${encodeURIComponent(pick(NASTY_STRINGS))}`, what: 'form-encoded' }
    return { contentType: rand() < 0.5 ? 'application/json' : undefined, raw: '', what: 'empty body' }
  }
}

async function send(method: string, path: string, attempt: Attempt, cookie: string | undefined, extraHeaders: Record<string, string>) {
  const headers: Record<string, string> = { ...extraHeaders }
  if (cookie) headers.cookie = cookie
  if (attempt.contentType) headers['content-type'] = attempt.contentType
  const res = await fetch(baseURL() + path, { method, headers, body: attempt.raw === '' ? undefined : attempt.raw, redirect: 'manual' })
  const text = await res.text()
  let body: any = null
  try { body = JSON.parse(text) }
  catch { /* checked below */ }
  return { status: res.status, body, text }
}

async function pool<T>(items: T[], work: (item: T) => Promise<void>) {
  let next = 0
  await Promise.all(Array.from({ length: CONCURRENCY }, async () => {
    while (next < items.length) await work(items[next++]!)
  }))
}

describe('fuzzing every mutating route', () => {
  const routes = apiRoutes().filter(r => r.method !== 'GET' && !SKIP.has(r.key))
  const real: Record<string, string> = {}

  beforeAll(async () => {
    // Real records in states that refuse the request even when the body is acceptable: a fired run that has its result
    // (nothing more can happen to it without a valid signature or revision) and a plan with no draft runs.
    const v = await registerVessel()
    const [run] = await readyRuns(v.id, [{ kind: 'standardisation', materialId: await benzoicAcidId(), massG: 1 }])
    expect((await fire(run!.id, { weighedMassG: 1 })).status).toBe(201)
    const result = await enterResult(run!.id, { temperatureRiseK: 2.655, fuse: { wire: 'nichrome', burntLengthCm: 10 } })
    expect(result.status, JSON.stringify(result.body)).toBe(201)
    const { rows: [plan] } = await testDb().query('select plan_id from runs where id = $1', [run!.id])
    const { rows: [user] } = await testDb().query(`select id from users where email = 'analyst2@emberline.test'`)
    const { rows: [material] } = await testDb().query('select id from materials order by name limit 1')
    const { rows: [sample] } = await testDb().query('select id from samples order by lab_code limit 1')
    Object.assign(real, { sample: sample?.id ?? randomUUID(), vessel: v.id, run: run!.id, result: result.body.result.id, plan: plan.plan_id, user: user.id, material: material.id })
    for (const role of ['analyst', 'supervisor', 'technician', 'admin'] as DemoRole[]) await as(role)
  })

  it('covers every mutating route in the roles table and the poison table', () => {
    for (const r of routes) {
      expect(MATRIX[r.key], r.key).toBeDefined()
      if (r.key !== 'POST /api/vessels/[id]/attachments' && r.key !== 'POST /api/samples/[id]/photos' && r.key !== 'POST /api/plans/[id]/submit' && !RANDOM_IDS_ONLY.has(r.key)) expect(POISON[r.key], r.key).toBeDefined()
    }
  })

  for (const [index, r] of routes.entries()) {
    it(`${r.key}: ${PER_ROUTE} hostile requests → 4xx with a message, nothing changed`, async () => {
      const who = MATRIX[r.key]!
      const role: DemoRole | undefined = who === 'public' ? undefined : who === 'all' ? 'analyst' : who[0]
      const cookie = role ? await as(role) : undefined
      const tables = r.key === 'POST /api/auth/login' ? DOMAIN_TABLES : [...DOMAIN_TABLES, ...TRAIL_TABLES]
      // The scheduled fleet check (server/plugins/reminders.ts) records vessel state changes and their mail in the
      // background; running it now settles them, so that its next tick finds nothing new during this route's fuzzing.
      expect((await call('POST', '/api/admin/reminders/run', { cookie: await as('admin'), body: {} })).status).toBe(200)
      const before = await checksums(tables)

      const segment = r.file.match(/\[(\w+)\]/)?.[1]
      const realId = segment ? real[r.file.split('/')[0]!.replace(/s$/, '').replace('admin', 'user')] : undefined
      const ids = !segment ? [''] : [...(RANDOM_IDS_ONLY.has(r.key) ? [] : [realId!]), randomUUID(), randomUUID(), 'not-a-uuid', '%27%3B%20drop%20table%20runs%3B%20--']
      const rand = seeded(SEED + index)
      const next = generator(rand, POISON[r.key])
      const jobs = Array.from({ length: PER_ROUTE }, (_, i) => ({ i, id: ids[i % ids.length]!, attempt: next() }))
      const failures: string[] = []
      await pool(jobs, async ({ i, id, attempt }) => {
        const path = segment ? r.path.replace(SAMPLE_ID, id) : r.path
        const headers: Record<string, string> = r.key === 'POST /api/runs/[id]/firing' ? { 'Idempotency-Key': randomUUID() } : {}
        const res = await send(r.method, path, attempt, cookie, headers)
        const ok = res.status >= 400 && res.status < 500 && typeof res.body?.message === 'string' && res.body.message.length > 0
        if (!ok) failures.push(`#${i} (seed ${SEED + index}) ${attempt.what} at ${path} → ${res.status} ${res.text.slice(0, 200)}`)
      })
      expect(failures.slice(0, 5)).toEqual([])
      expect(await checksums(tables)).toEqual(before)
    })
  }
})
