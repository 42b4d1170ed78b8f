// npm run bench (through scripts/bench.sh, which starts the built server): prints one markdown table of speed figures.
// Progress goes to stderr so that stdout is only the table. Figures are printed, never asserted.
import { cpus, loadavg } from 'node:os'
import { gzipSync } from 'node:zlib'
import { assessCharge, type ChargeInput } from '../shared/domain/assessment'
import { DEFAULT_POLICY } from '../shared/domain/policy'

const BASE = process.env.EMBERLINE_BENCH_URL ?? 'http://127.0.0.1:3000'
const CONNECTIONS = Number(process.env.EMBERLINE_BENCH_CONNECTIONS ?? 8)
const SECONDS = Number(process.env.EMBERLINE_BENCH_SECONDS ?? 10)
const EMAIL = 'analyst@emberline.test'
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

async function signIn(): Promise<string> {
  const res = await fetch(`${BASE}/api/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email: EMAIL, password: PASSWORD }) })
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

async function main() {
  const loadBefore = loadavg()[0] ?? 0
  log('assessCharge in this Node process')
  const node = benchNode()

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
  log('client JS of /check')
  const weight = await pageWeight(cookie, '/check')

  const conditions = `${CONNECTIONS} connections, ${SECONDS} s in alternating slices, Node ${process.version}, fetch (undici) keep-alive`
  const rows = [
    ['One assessment in Node (`assessCharge`, median)', `${fmt(node.oneUs, 1)} µs`, 'coal + benzoic-acid aid + nickel-chromium fuse; 20,000 runs after 2,000 warm-up'],
    ['1,000 charges in Node', `${fmt(node.thousandMs, 1)} ms`, 'sample mass varied; median of 7 rounds'],
    ['`POST /api/assess` (vesselId of a vessel in service)', `${fmt(assess.rps)} req/s`, `median latency ${fmt(assess.p50Ms, 1)} ms; ${conditions}`],
    ['`GET /api/settings` (trivial authenticated route)', `${fmt(trivial.rps)} req/s`, `median latency ${fmt(trivial.p50Ms, 1)} ms; same server and conditions`],
    ['Ratio assess / trivial', fmt(assess.rps / trivial.rps, 2), `aim ≥ 0.5; ${cpus().length} cores, load average ${fmt(loadBefore, 1)} at the start (the load generator shares the machine)`],
    ['Quick check page, client JS', `${fmt(weight.gzipKB, 1)} kB gzip`, `${weight.files} files (${fmt(weight.rawKB, 0)} kB raw) from script and modulepreload tags; formula and SMILES libraries load later, on first use`],
  ]
  const out = ['| Measure | Result | Conditions |', '|---|---|---|', ...rows.map(r => `| ${r.join(' | ')} |`)]
  process.stdout.write(`${out.join('\n')}\n`)
}

main().catch((error) => {
  console.error(error instanceof Error ? error.message : error)
  process.exit(1)
})
