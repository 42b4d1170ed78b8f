// Summarises a V8 CPU profile (`node --cpu-prof` writes *.cpuprofile): the functions with the most self time, the
// functions with the most inclusive time (each sample counted once per function on its stack), and self time by
// package or source area. Usage: node scripts/profile-summary.mjs file.cpuprofile [--top 25] [--requests N]
// With --requests, each figure is also given per request (the profile's busy time divided by N); with --from-ms and
// --to-ms only the samples taken that long after the profile began count (to leave out start-up and warm-up); with
// --last-ms only the samples of the profile's last N ms. --show NAME,NAME prints the inclusive time of those functions.
import { readFileSync } from 'node:fs'

const args = process.argv.slice(2)
const file = args.find(a => !a.startsWith('--'))
const option = (name, fallback) => {
  const i = args.indexOf(`--${name}`)
  return i >= 0 ? Number(args[i + 1]) : fallback
}
if (!file) {
  console.error('usage: node scripts/profile-summary.mjs file.cpuprofile [--top 25] [--requests N]')
  process.exit(2)
}
const top = option('top', 25)
const requests = option('requests', 0)
const fromMs = option('from-ms', 0)
const toMs = option('to-ms', Infinity)
const lastMs = option('last-ms', 0)
const showIndex = args.indexOf('--show')
const show = showIndex >= 0 ? args[showIndex + 1].split(',') : []
const profile = JSON.parse(readFileSync(file, 'utf8'))

const nodes = new Map(profile.nodes.map(n => [n.id, n]))
const parent = new Map()
for (const n of profile.nodes) for (const c of n.children ?? []) parent.set(c, n.id)

// Where a source file belongs: its package under node_modules, the app's own code, Node itself, or V8's pseudo-frames.
function area(url, name) {
  if (!url) return name.startsWith('(') ? name : '(native)'
  const pkg = url.match(/node_modules\/((?:@[^/]+\/)?[^/]+)/)
  if (pkg) return pkg[1]
  if (url.startsWith('node:')) return 'node:' + url.slice(5).split('/')[0]
  if (url.includes('/.output/server/chunks/')) return 'app (server chunks)'
  if (url.includes('/.output/server/')) return 'app (server entry)'
  return url.replace(/^file:\/\//, '').split('/').slice(-2).join('/')
}
const label = (n) => {
  const { functionName, url, lineNumber } = n.callFrame
  const where = url ? `${url.replace(/^file:\/\/.*?(node_modules\/|\.output\/)/, '$1')}:${lineNumber + 1}` : ''
  return `${functionName || '(anonymous)'} ${where}`.trim()
}

const self = new Map()
const inclusive = new Map()
const byArea = new Map()
let total = 0
let idle = 0
const add = (map, key, dt) => map.set(key, (map.get(key) ?? 0) + dt)
const span = profile.timeDeltas.reduce((a, b) => a + b, 0) / 1000
const from = lastMs ? span - lastMs : fromMs
let clock = 0
profile.samples.forEach((id, i) => {
  const dt = (profile.timeDeltas[i] ?? 0) / 1000
  clock += dt
  if (clock < from || clock > toMs) return
  const node = nodes.get(id)
  if (!node) return
  total += dt
  const name = node.callFrame.functionName
  if (name === '(idle)') {
    idle += dt
    return
  }
  add(self, label(node), dt)
  add(byArea, area(node.callFrame.url, name), dt)
  const seen = new Set()
  for (let cur = id; cur !== undefined; cur = parent.get(cur)) {
    const key = label(nodes.get(cur))
    if (seen.has(key)) continue
    seen.add(key)
    add(inclusive, key, dt)
  }
})

const busy = total - idle
const row = (ms) => {
  const pct = busy ? (100 * ms / busy).toFixed(1).padStart(5) : '    –'
  const per = requests ? `  ${(1000 * ms / requests).toFixed(1).padStart(7)} µs/req` : ''
  return `${ms.toFixed(0).padStart(8)} ms ${pct} %${per}`
}
const print = (title, map, n = top) => {
  console.log(`\n## ${title}`)
  for (const [key, ms] of [...map].sort((a, b) => b[1] - a[1]).slice(0, n)) console.log(`${row(ms)}  ${key}`)
}

console.log(`profile: ${file}`)
console.log(`sampled ${total.toFixed(0)} ms, busy ${busy.toFixed(0)} ms, idle ${idle.toFixed(0)} ms${requests ? `, ${requests} requests: ${(busy / requests).toFixed(2)} ms of CPU per request` : ''}`)
print('Self time by package or area', byArea, 20)
print('Self time by function', self)
print('Inclusive time by function (each sample once per function on its stack)', inclusive)
if (show.length) print(`Inclusive time of ${show.join(', ')}`, new Map([...inclusive].filter(([key]) => show.includes(key.split(' ')[0]))), 50)
