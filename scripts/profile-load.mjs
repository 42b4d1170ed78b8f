// Load for scripts/profile.sh: signs in as the demo analyst, keeps `connections` requests of one route in flight for
// `seconds` (after 2 s of warm-up), prints the number of requests answered in the measured part and its start and end (ms since the epoch) to stdout and the
// rate to stderr. Any answer but 200 stops it. EMBERLINE_LOAD_BODY (JSON) makes each request a POST of that body.
const [route = '/api/settings', seconds = '6', connections = '10'] = process.argv.slice(2)
const base = process.env.EMBERLINE_LOAD_URL ?? 'http://127.0.0.1:3000'
const email = process.env.EMBERLINE_LOAD_EMAIL ?? 'analyst@emberline.test'
const password = process.env.EMBERLINE_LOAD_PASSWORD ?? 'ember-demo-2026'
const body = process.env.EMBERLINE_LOAD_BODY

const login = await fetch(`${base}/api/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email, password }) })
if (!login.ok) throw new Error(`sign-in failed: ${login.status} ${await login.text()}`)
const cookie = login.headers.getSetCookie().find(c => c.startsWith('emberline-session='))?.split(';')[0]
if (!cookie) throw new Error('no session cookie')

async function run(ms) {
  const deadline = performance.now() + ms
  let done = 0
  await Promise.all(Array.from({ length: Number(connections) }, async () => {
    while (performance.now() < deadline) {
      const headers = { cookie, accept: route.startsWith('/api/') ? 'application/json' : 'text/html' }
      const res = await fetch(base + route, body ? { method: 'POST', headers: { ...headers, 'content-type': 'application/json' }, body } : { headers })
      await res.arrayBuffer()
      if (res.status !== 200) throw new Error(`${route} answered ${res.status}`)
      done++
    }
  }))
  return done
}
await run(2000)
const from = Date.now()
const n = await run(Number(seconds) * 1000)
process.stderr.write(`${route}: ${(n / Number(seconds)).toFixed(0)} req/s\n`)
console.log(`${n} ${from} ${Date.now()}`)
