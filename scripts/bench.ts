// npm run bench (through scripts/bench.sh, which starts the built server): prints one markdown table of speed figures.
// Progress goes to stderr so that stdout is only the table. Figures are printed, never asserted.
import { readdirSync, readFileSync } from 'node:fs'
import { cpus, loadavg } from 'node:os'
import { gzipSync } from 'node:zlib'
import { assessCharge, type ChargeInput } from '../shared/domain/assessment'
import { DEFAULT_POLICY } from '../shared/domain/policy'
import { benchDayPlan } from './bench-day-plan'

const BASE = process.env.EMBERLINE_BENCH_URL ?? 'http://127.0.0.1:3000'
const CONNECTIONS = Number(process.env.EMBERLINE_BENCH_CONNECTIONS ?? 8)
const SECONDS = Number(process.env.EMBERLINE_BENCH_SECONDS ?? 10)
const EMAIL = 'analyst@emberline.test'
const SERVER_PID = process.env.EMBERLINE_BENCH_SERVER_PID
const MIXED_SECONDS = Number(process.env.EMBERLINE_BENCH_MIXED_SECONDS ?? 60)
const MIXED_USERS = 50
const PASSWORD = process.env.EMBERLINE_BENCH_PASSWORD ?? 'ember-demo-2026'

const log = (text: string) => process.stderr.write(`› ${text}\n`)
const median = (xs: number[]) => {
  const s = [...xs].sort((a, b) => a - b)
  const mid = Math.floor(s.length / 2)
  return s.length % 2 ? s[mid]! : (s[mid - 1]! + s[mid]!) / 2
}
const fmt = (x: number, digits = 0) => x.toLocaleString('en-GB', { minimumFractionDigits: digits, maximumFractionDigits: digits })

// A typical bench charge: a coal with its ultimate analysis, a benzoic-acid aid and a nickel-chromium fuse in a 300 mL vessel.
function typicalCharge(sampleMassG = 0.8): ChargeInput {
  return {
    vessel: { ratedEnergyJ: 33000, maxChargeMassG: 1.5, maxFillPressureMPa: 4.05, volumeMl: 300, class: 'standard', name: 'bench' },
    fillPressureMPa: 3.0,
    components: [
      { role: 'sample', massG: sampleMassG, composition: { C: 72.1, H: 4.9, N: 1.4, S: 0.9, O: 8.2, ash: 9.5, moisture: 3.0, basis: 'as-received' } },
      { role: 'aid', massG: 0.2, heatingValueJPerG: 26454, name: 'benzoic acid' },
      { role: 'fuse', wire: 'nichrome', lengthCm: 10 },
    ],
  }
}

function benchNode() {
  const input = typicalCharge()
  for (let i = 0; i < 2000; i++) assessCharge(input, DEFAULT_POLICY)
  const times: number[] = []
  for (let i = 0; i < 20000; i++) {
    const t0 = process.hrtime.bigint()
    assessCharge(input, DEFAULT_POLICY)
    times.push(Number(process.hrtime.bigint() - t0) / 1000)
  }
  const charges = Array.from({ length: 1000 }, (_, i) => typicalCharge(0.2 + (i % 100) * 0.012))
  const rounds: number[] = []
  for (let r = 0; r < 7; r++) {
    const t0 = process.hrtime.bigint()
    for (const c of charges) assessCharge(c, DEFAULT_POLICY)
    rounds.push(Number(process.hrtime.bigint() - t0) / 1e6)
  }
  return { oneUs: median(times), thousandMs: median(rounds) }
}

async function signIn(email = EMAIL): Promise<string> {
  const res = await fetch(`${BASE}/api/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email, password: PASSWORD }) })
  if (!res.ok) throw new Error(`sign-in failed: ${res.status} ${await res.text()}`)
  const cookie = res.headers.getSetCookie().find(c => c.startsWith('emberline-session='))
  if (!cookie) throw new Error('no session cookie')
  return cookie.split(';')[0]!
}

type Route = { name: string, request: () => Promise<Response> }

/** CONNECTIONS requests of one route in flight for `ms`; any answer but 200 stops the bench. */
async function slice(route: Route, ms: number, latencies?: number[]): Promise<{ done: number, seconds: number }> {
  const t0 = performance.now()
  const deadline = t0 + ms
  let done = 0
  await Promise.all(Array.from({ length: CONNECTIONS }, async () => {
    while (performance.now() < deadline) {
      const start = performance.now()
      const res = await route.request()
      await res.arrayBuffer()
      if (res.status !== 200) throw new Error(`${route.name} answered ${res.status}`)
      latencies?.push(performance.now() - start)
      done++
    }
  }))
  return { done, seconds: (performance.now() - t0) / 1000 }
}

/**
 * Requests per second of two routes on the same server, SECONDS each, in alternating slices (A B B A …) so that a
 * change in the machine's background load falls on both alike and their ratio stays fair.
 */
async function compare(a: Route, b: Route) {
  log(`${a.name} against ${b.name}: ${CONNECTIONS} connections, ${SECONDS} s each in alternating slices (after warm-up)`)
  await slice(a, 1000)
  await slice(b, 1000)
  const rounds = Math.max(1, Math.round(SECONDS / 2))
  const sliceMs = (SECONDS * 1000) / rounds
  const stats = [a, b].map(() => ({ done: 0, seconds: 0, latencies: [] as number[] }))
  for (let r = 0; r < rounds; r++) {
    const order = r % 2 === 0 ? [0, 1] : [1, 0]
    for (const i of order) {
      const s = await slice(i === 0 ? a : b, sliceMs, stats[i]!.latencies)
      stats[i]!.done += s.done
      stats[i]!.seconds += s.seconds
    }
  }
  return stats.map(s => ({ rps: s.done / s.seconds, p50Ms: median(s.latencies) }))
}

/** Sum of the gzip sizes of the JS the page loads at once: script srcs and modulepreloads in its server-rendered HTML. */
async function pageWeight(cookie: string, path: string) {
  const html = await (await fetch(`${BASE}${path}`, { headers: { cookie } })).text()
  const srcs = new Set<string>()
  for (const m of html.matchAll(/<script\b[^>]*\bsrc="([^"]+)"/g)) srcs.add(m[1]!)
  for (const m of html.matchAll(/<link\b[^>]*\brel="modulepreload"[^>]*\bhref="([^"]+)"/g)) srcs.add(m[1]!)
  let gzip = 0
  let raw = 0
  for (const src of srcs) {
    const body = Buffer.from(await (await fetch(new URL(src, BASE))).arrayBuffer())
    raw += body.length
    gzip += gzipSync(body, { level: 9 }).length
  }
  if (!srcs.size) throw new Error(`no scripts found on ${path}: is the session valid?`)
  return { files: srcs.size, gzipKB: gzip / 1024, rawKB: raw / 1024 }
}

const p95 = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.min(xs.length - 1, Math.ceil(xs.length * 0.95) - 1)]!

/** Median and p95 latency of one request made `n` times, one at a time, after 3 warm-up requests; any answer but `ok` stops the bench. */
async function latency(name: string, request: () => Promise<Response>, n = 40, ok = 200) {
  const times: number[] = []
  for (let i = 0; i < n + 3; i++) {
    const t0 = performance.now()
    const res = await request()
    if (res.status !== ok) throw new Error(`${name} answered ${res.status}: ${await res.text()}`)
    await res.arrayBuffer()
    if (i >= 3) times.push(performance.now() - t0)
  }
  return { name, p50: median(times), p95: p95(times), n }
}

/** Peak resident memory of the server so far (VmHWM), when bench.sh passes its pid. */
function peakRssMB(): number | null {
  if (!SERVER_PID) return null
  // The server may be a primary with one worker per core: add up the high-water marks of the whole tree.
  const pids = [Number(SERVER_PID)]
  for (const entry of readdirSync('/proc')) {
    if (!/^\d+$/.test(entry)) continue
    try {
      const stat = readFileSync(`/proc/${entry}/stat`, 'utf8')
      const ppid = Number(stat.slice(stat.lastIndexOf(')') + 2).split(' ')[1])
      if (ppid === Number(SERVER_PID)) pids.push(Number(entry))
    }
    catch { /* ended meanwhile */ }
  }
  let total = 0
  for (const pid of pids) {
    const m = readFileSync(`/proc/${pid}/status`, 'utf8').match(/VmHWM:\s+(\d+) kB/)
    if (m) total += Number(m[1]) / 1024
  }
  return total
}

interface LargeLab { vesselId: string, planId: string, audit: string }

/** The large lab that scripts/bench-seed.ts loaded: a load vessel, one of its plans of 100 runs, and the analyst's name. */
async function largeLab(cookie: string): Promise<LargeLab> {
  const vessels = await (await fetch(`${BASE}/api/vessels`, { headers: { cookie } })).json() as { id: string, name: string }[]
  const vessel = vessels.find(v => v.name === 'Load 01')
  if (!vessel) throw new Error('the large lab is not loaded: run scripts/bench-seed.ts first')
  const plans = await (await fetch(`${BASE}/api/plans?pageSize=200&q=Load%20plan%201`, { headers: { cookie } })).json() as { rows?: { id: string, name: string }[] } | { id: string, name: string }[]
  const list = Array.isArray(plans) ? plans : plans.rows ?? []
  const plan = list.find(p => p.name === 'Load plan 1') ?? list.find(p => p.name.startsWith('Load plan '))
  if (!plan) throw new Error('no load plan found through GET /api/plans')
  // The audit search a supervisor makes: the analyst's surname, over the last 30 days (about 43,000 of the 200,000 rows).
  const me = await (await fetch(`${BASE}/api/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email: EMAIL, password: PASSWORD }) })).json() as { user: { name: string } }
  const actor = encodeURIComponent(me.user.name.split(' ').at(-1)!)
  const from = new Date(Date.now() - 30 * 86_400_000).toISOString()
  return { vesselId: vessel.id, planId: plan.id, audit: `/api/audit?actor=${actor}&from=${encodeURIComponent(from)}` }
}

/** Ready runs on a fresh vessel made through the API (plan, runs, submit), for timing firings. */
async function readyRuns(admin: string, analyst: string, n: number) {
  const json = { 'content-type': 'application/json' }
  const tag = Date.now().toString(36)
  const v = await fetch(`${BASE}/api/vessels`, {
    method: 'POST', headers: { ...json, cookie: admin },
    body: JSON.stringify({ name: `Bench ${tag}`, serialNumber: `BENCH-${tag}`, class: 'standard', ratedEnergyJ: 33000, maxChargeMassG: 1.5, maxFillPressureMPa: 4.05, volumeMl: 300, serviceIntervalFirings: 100000, requalificationIntervalFirings: 1000000 }),
  })
  if (v.status !== 201) throw new Error(`POST /api/vessels answered ${v.status}: ${await v.text()}`)
  const vesselId = ((await v.json()) as { id: string }).id
  const p = await fetch(`${BASE}/api/plans`, { method: 'POST', headers: { ...json, cookie: analyst }, body: JSON.stringify({ name: `Bench firings ${tag}`, vesselId, fillPressureMPa: 3.0 }) })
  const planId = ((await p.json()) as { id: string }).id
  const ids: string[] = []
  for (let i = 0; i < n; i++) {
    // 0.8 g at 26 454 J/g (NIST SRM 39j, weighed in air) on 10 cm Ni-Cr fuse: a clear charge in a 33 kJ vessel. The
    // sample's structure (benzoic acid) is its identity: a sample without one needs a supervisor's approval first.
    const r = await fetch(`${BASE}/api/plans/${planId}/runs`, {
      method: 'POST', headers: { ...json, cookie: analyst },
      body: JSON.stringify({ sampleCode: `B-${tag}-${i}`, components: [{ role: 'sample', name: 'bench sample', massG: 0.8, heatingValueJPerG: 26454, smiles: 'OC(=O)c1ccccc1' }, { role: 'fuse', wire: 'nichrome', lengthCm: 10 }] }),
    })
    if (r.status !== 201) throw new Error(`POST runs answered ${r.status}: ${await r.text()}`)
    ids.push(((await r.json()) as { id: string }).id)
  }
  const s = await fetch(`${BASE}/api/plans/${planId}/submit`, { method: 'POST', headers: { ...json, cookie: analyst }, body: '{}' })
  if (s.status !== 200) throw new Error(`submit answered ${s.status}`)
  const counts = ((await s.json()) as { counts: Record<string, number> }).counts
  if (counts.ready !== n) throw new Error(`submitted runs are not all ready to fire: ${JSON.stringify(counts)}`)
  return ids
}

/** MIXED_USERS concurrent users for MIXED_SECONDS, each cycling through the pages a lab day is made of. */
/** The plan page's request: a page of 100 runs with the summary of each assessment. */
const PLAN_PAGE = (planId: string) => `/api/plans/${planId}?runsLimit=100&assessment=summary`

async function mixedLoad(lab: LargeLab, analyst: string, supervisor: string, assessBody: string) {
  const json = { 'content-type': 'application/json' }
  const steps: { cookie: string, path: string, body?: string }[] = [
    { cookie: analyst, path: '/api/fleet' },
    { cookie: analyst, path: `/api/vessels/${lab.vesselId}` },
    { cookie: analyst, path: `/api/vessels/${lab.vesselId}/firings` },
    { cookie: analyst, path: PLAN_PAGE(lab.planId) },
    { cookie: analyst, path: '/api/assess', body: assessBody },
    { cookie: analyst, path: '/api/materials?pageSize=50' },
    { cookie: supervisor, path: '/api/approvals' },
    { cookie: supervisor, path: lab.audit },
  ]
  const times: number[] = []
  let errors = 0
  const deadline = performance.now() + MIXED_SECONDS * 1000
  await Promise.all(Array.from({ length: MIXED_USERS }, async (_, u) => {
    let i = u
    while (performance.now() < deadline) {
      const s = steps[i++ % steps.length]!
      const t0 = performance.now()
      try {
        const res = await fetch(`${BASE}${s.path}`, s.body ? { method: 'POST', headers: { ...json, cookie: s.cookie }, body: s.body } : { headers: { cookie: s.cookie } })
        await res.arrayBuffer()
        if (res.status !== 200) errors++
      }
      catch { errors++ }
      times.push(performance.now() - t0)
    }
  }))
  return { requests: times.length, errors, p50: median(times), p95: p95(times), rps: times.length / MIXED_SECONDS }
}

/** `/api/health` one request at a time, alone and while 20 wrong sign-ins for one account arrive at once. */
async function healthDuringBurst() {
  const health = async () => {
    const t0 = performance.now()
    const res = await fetch(`${BASE}/api/health`)
    await res.arrayBuffer()
    return performance.now() - t0
  }
  const quiet: number[] = []
  for (let i = 0; i < 30; i++) quiet.push(await health())
  // An address that is no account: the throttle and the equalising hash work exactly as for a real one.
  const email = `bench-burst-${Date.now().toString(36)}@emberline.test`
  let running = true
  const burst = Promise.all(Array.from({ length: 20 }, (_, i) => fetch(`${BASE}/api/auth/login`, {
    method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email, password: `wrong-${i}` }),
  }).then(r => r.status))).finally(() => { running = false })
  const during: number[] = []
  while (running || during.length < 20) during.push(await health())
  const statuses = await burst
  return { quiet: median(quiet), during: median(during), p95: p95(during), n: during.length, hashed: statuses.filter(s => s === 401).length, throttled: statuses.filter(s => s === 429).length }
}

async function main() {
  const loadBefore = loadavg()[0] ?? 0
  log('assessCharge in this Node process')
  const node = benchNode()
  log('day plan: 50 vessels × 500 samples')
  const day = benchDayPlan()

  const cookie = await signIn()
  const vessels = await (await fetch(`${BASE}/api/vessels`, { headers: { cookie } })).json() as { id: string, state: string }[]
  const vessel = vessels.find(v => v.state === 'in-service')
  if (!vessel) throw new Error('no vessel in service in the bench database')
  const { vessel: _inline, ...charge } = typicalCharge()
  const assessBody = JSON.stringify({ ...charge, vesselId: vessel.id })
  const headers = { cookie, 'content-type': 'application/json' }
  const check = await fetch(`${BASE}/api/assess`, { method: 'POST', headers, body: assessBody })
  if (check.status !== 200) throw new Error(`POST /api/assess answered ${check.status}: ${await check.text()}`)

  const [assess, trivial] = await compare(
    { name: 'POST /api/assess', request: () => fetch(`${BASE}/api/assess`, { method: 'POST', headers, body: assessBody }) },
    { name: 'GET /api/settings', request: () => fetch(`${BASE}/api/settings`, { headers: { cookie } }) },
  )
  if (!assess || !trivial) throw new Error('no load figures')
  // The ratios the lab watches, each pair measured in the same run: what a session and the policy cost a request,
  // and what a signed-in, server-rendered page with its data costs against the sign-in page.
  const [health, settings] = await compare(
    { name: 'GET /api/health', request: () => fetch(`${BASE}/api/health`) },
    { name: 'GET /api/settings', request: () => fetch(`${BASE}/api/settings`, { headers: { cookie } }) },
  )
  const [loginPage, today] = await compare(
    { name: 'GET /login', request: () => fetch(`${BASE}/login`) },
    { name: 'GET / (Today)', request: () => fetch(`${BASE}/`, { headers: { cookie } }) },
  )
  // The signed-in page shell on its own (a page with little data), to tell the shell from Today's own work.
  const [loginAgain, account] = await compare(
    { name: 'GET /login', request: () => fetch(`${BASE}/login`) },
    { name: 'GET /account', request: () => fetch(`${BASE}/account`, { headers: { cookie } }) },
  )
  if (!health || !settings || !loginPage || !today || !loginAgain || !account) throw new Error('no ratio figures')
  log('client JS of /check')
  const weight = await pageWeight(cookie, '/check')

  log('large lab: route latencies (one request at a time, 40 each after 3 warm-up)')
  const supervisor = await signIn('supervisor@emberline.test')
  const admin = await signIn('admin@emberline.test')
  const lab = await largeLab(cookie)
  const get = (path: string, who = cookie) => () => fetch(`${BASE}${path}`, { headers: { cookie: who } })
  const routes = [
    await latency('`GET /api/fleet` (fleet page)', get('/api/fleet')),
    await latency('`GET /api/vessels/:id` (vessel page)', get(`/api/vessels/${lab.vesselId}`)),
    await latency('`GET /api/vessels/:id/services`', get(`/api/vessels/${lab.vesselId}/services`)),
    await latency('`GET /api/vessels/:id/firings` (vessel of 2,000 firings)', get(`/api/vessels/${lab.vesselId}/firings`)),
    await latency('`GET /api/plans/:id` (plan of 100 runs, whole assessments)', get(`/api/plans/${lab.planId}`)),
    await latency('`GET /api/plans/:id?runsLimit=100&assessment=summary` (plan of 100 runs, as the plan page asks)', get(PLAN_PAGE(lab.planId))),
    await latency('`GET /api/approvals` (approvals queue)', get('/api/approvals', supervisor)),
    await latency('`GET /api/audit?actor=…&from=…` (audit search)', get(lab.audit, supervisor)),
    await latency('`POST /api/assess`', () => fetch(`${BASE}/api/assess`, { method: 'POST', headers, body: assessBody })),
  ]
  log('large lab: 40 firings through the API')
  const fireIds = await readyRuns(admin, cookie, 43)
  let nextRun = 0
  routes.push(await latency('`POST /api/runs/:id/firing` (a firing)', () => fetch(`${BASE}/api/runs/${fireIds[nextRun++]}/firing`, {
    method: 'POST', headers: { ...headers, 'idempotency-key': crypto.randomUUID() }, body: JSON.stringify({ outcome: 'complete', weighedMassG: 0.8 }),
  }), 40, 201))
  log(`large lab: mixed load, ${MIXED_USERS} users for ${MIXED_SECONDS} s`)
  const mixed = await mixedLoad(lab, cookie, supervisor, assessBody)
  const pages = ['/', '/vessels', `/vessels/${lab.vesselId}`, '/plans', `/plans/${lab.planId}`, '/materials', '/approvals', '/audit']
  const weights: [string, Awaited<ReturnType<typeof pageWeight>>][] = []
  for (const page of pages) weights.push([page, await pageWeight(page === '/audit' || page === '/approvals' ? supervisor : cookie, page)])
  log('/api/health during a burst of 20 wrong sign-ins')
  const burst = await healthDuringBurst()
  const rss = peakRssMB()

  const conditions = `${CONNECTIONS} connections, ${SECONDS} s in alternating slices, Node ${process.version}, fetch (undici) keep-alive`
  const rows = [
    ['One assessment in Node (`assessCharge`, median)', `${fmt(node.oneUs, 1)} µs`, 'coal + benzoic-acid aid + nickel-chromium fuse; 20,000 runs after 2,000 warm-up'],
    ['1,000 charges in Node', `${fmt(node.thousandMs, 1)} ms`, 'sample mass varied; median of 7 rounds'],
    [`Day plan, ${day.vesselCount} vessels × ${day.sampleCount} samples: the heuristic (\`proposeDay\`)`, `${fmt(day.planMs, 1)} ms`, `${fmt(day.runs)} runs (duplicates), ${fmt(day.placed)} placed in one 8 h day; generated lab (tests/support/day-plan-lab.ts); median of ${day.rounds} rounds`],
    [`Day plan, same lab: charge assessment of every sample on every vessel`, `${fmt(day.assessMs, 0)} ms`, `${fmt(day.sampleCount * day.vesselCount)} assessments (duplicates share one); median of ${day.rounds} rounds`],
    ['`POST /api/assess` (vesselId of a vessel in service)', `${fmt(assess.rps)} req/s`, `median latency ${fmt(assess.p50Ms, 1)} ms; ${conditions}`],
    ['`GET /api/settings` (trivial authenticated route)', `${fmt(trivial.rps)} req/s`, `median latency ${fmt(trivial.p50Ms, 1)} ms; same server and conditions`],
    ['`GET /api/health` (public, one `select 1`)', `${fmt(health.rps)} req/s`, `median latency ${fmt(health.p50Ms, 1)} ms; ${conditions}`],
    ['`GET /api/settings` against health', `${fmt(settings.rps)} req/s = ${fmt(settings.rps / health.rps, 2)} × health`, 'aim ≥ 0.6 × health, measured in alternating slices with it'],
    ['`GET /login` (server-rendered, no data)', `${fmt(loginPage.rps)} req/s`, `median latency ${fmt(loginPage.p50Ms, 1)} ms`],
    ['`GET /` Today (server-rendered, signed in, large lab)', `${fmt(today.rps)} req/s = ${fmt(today.rps / loginPage.rps, 2)} × /login`, 'aim ≥ 0.5 × the sign-in page, alternating slices with it'],
    ['`GET /account` (server-rendered, signed in, little data)', `${fmt(account.rps)} req/s = ${fmt(account.rps / loginAgain.rps, 2)} × /login`, `the signed-in page shell alone (no aim); alternating slices with /login at ${fmt(loginAgain.rps)} req/s`],
    ['Ratio assess / trivial', fmt(assess.rps / trivial.rps, 2), `aim ≥ 0.5; ${cpus().length} cores, load average ${fmt(loadBefore, 1)} at the start (the load generator shares the machine)`],
    ['Quick check page, client JS', `${fmt(weight.gzipKB, 1)} kB gzip`, `${weight.files} files (${fmt(weight.rawKB, 0)} kB raw) from script and modulepreload tags; formula and SMILES libraries load later, on first use`],
    ...routes.map(r => [`Large lab: ${r.name}`, `${fmt(r.p50, 1)} ms median, ${fmt(r.p95, 1)} ms p95`, `${r.n} requests one at a time; 50 vessels, 100,000 firings, 20,000 materials, 200,000 audit rows (scripts/bench-seed.ts)`]),
    ['Large lab: mixed load', `${fmt(mixed.p95, 0)} ms p95, ${mixed.errors} errors`, `${MIXED_USERS} concurrent users for ${MIXED_SECONDS} s over 8 routes (fleet, vessel, firings, plan, assess, materials, approvals, audit): ${fmt(mixed.requests)} requests, ${fmt(mixed.rps)} req/s, median ${fmt(mixed.p50, 0)} ms`],
    ['`GET /api/health` during 20 concurrent wrong sign-ins', `${fmt(burst.during, 1)} ms median, ${fmt(burst.p95, 1)} ms p95`, `${burst.n} requests one at a time while the burst ran (${fmt(burst.quiet, 1)} ms median alone); ${burst.hashed} attempts reached the password hash, ${burst.throttled} were refused with 429 before it; aim < 50 ms median`],
    ['Peak server memory (VmHWM)', rss === null ? 'not measured' : `${fmt(rss, 0)} MB`, 'resident set high-water marks of the server processes (primary and workers) over the whole bench, added up'],
    ...weights.map(([page, w]) => [`Client JS of \`${page.replace(/[0-9a-f-]{36}/, ':id')}\``, `${fmt(w.gzipKB, 1)} kB gzip`, `${w.files} files (${fmt(w.rawKB, 0)} kB raw) loaded at once`]),
  ]
  const out = ['| Measure | Result | Conditions |', '|---|---|---|', ...rows.map(r => `| ${r.join(' | ')} |`)]
  process.stdout.write(`${out.join('\n')}\n`)
}

main().catch((error) => {
  console.error(error instanceof Error ? error.message : error)
  process.exit(1)
})
