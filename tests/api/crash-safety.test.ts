import { spawnSync } from 'node:child_process'
import { randomUUID } from 'node:crypto'
import { fileURLToPath } from 'node:url'
import { afterAll, describe, expect, it, vi } from 'vitest'
import { as, DEMO_PASSWORD, sessionCookie, unique } from '../support/api'
import { testDb } from '../support/db'
import { newPlan, newVessel } from '../support/factories'
import { startServer } from '../support/server-process'
import type { ServerProcess } from '../support/server-process'
import { readyRuns, registerVessel } from '../unit/bench/bench-api'

// Crash safety: the server is killed with SIGKILL (no shutdown, as a power cut would leave it)
// in the middle of a burst of firings and of a large CSV import. After a restart every run is either fired with its
// firing row and its counter increment, or still ready with neither; an import is all of its rows or none.

const root = fileURLToPath(new URL('../..', import.meta.url))
const servers: ServerProcess[] = []
afterAll(async () => {
  for (const s of servers) await s.stop()
})

async function ownServer() {
  const s = await startServer()
  servers.push(s)
  return s
}

async function signInAt(base: string) {
  const res = await fetch(`${base}/api/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email: 'analyst@emberline.test', password: DEMO_PASSWORD }) })
  expect(res.status).toBe(200)
  return sessionCookie(res.headers)
}

function reconcileReport() {
  const res = spawnSync('npx', ['tsx', 'scripts/reconcile.ts', '--json'], { cwd: root, env: process.env, encoding: 'utf8', timeout: 60_000 })
  return JSON.parse(res.stdout) as { vessels: { id: string, mismatches: unknown[], checks: { recorded: number, expected: number }[] }[] }
}

/** True once the probe holds, false if it never did within the time (polled closely: the kill must land mid-write). */
function until(probe: () => Promise<boolean>, timeoutMs: number): Promise<boolean> {
  return vi.waitFor(async () => {
    if (!await probe()) throw new Error('not yet')
  }, { timeout: timeoutMs, interval: 5 }).then(() => true, () => false)
}

describe('crash safety', () => {
  it('leaves no firing without its counter increment and no increment without its firing when killed mid-burst', async () => {
    const vessel = await registerVessel()
    const runs = await readyRuns(vessel.id, Array.from({ length: 40 }, () => ({})))
    const server = await ownServer()
    const cookie = await signInAt(server.baseURL)
    let answered = 0
    // Four at a time, so that some firings are recorded, some in flight and some not yet sent when the kill lands.
    const queue = [...runs]
    const workers = Array.from({ length: 4 }, async () => {
      while (queue.length) {
        const run = queue.shift()!
        try {
          const res = await fetch(`${server.baseURL}/api/runs/${run.id}/firing`, {
            method: 'POST',
            headers: { 'cookie': cookie, 'content-type': 'application/json', 'idempotency-key': randomUUID() },
            body: JSON.stringify({ outcome: 'complete', weighedMassG: 1 }),
          })
          if (res.status === 201) answered++
          await res.text()
        }
        catch { /* the server died under this request */ }
      }
    })
    expect(await until(async () => answered >= 10, 30_000)).toBe(true)
    await server.kill()
    await Promise.all(workers)
    expect(answered).toBeLessThan(40)

    const restarted = await ownServer()
    expect((await fetch(`${restarted.baseURL}/api/health`)).ok).toBe(true)
    const { rows } = await testDb().query(
      `select r.id, r.status, (select count(*)::int from firings f where f.run_id = r.id) as firings from runs r where r.id = any($1::uuid[])`,
      [runs.map(r => r.id)],
    )
    for (const r of rows) expect([r.status, r.firings], r.id).toEqual(r.status === 'fired' ? ['fired', 1] : ['ready', 0])
    const fired = rows.filter(r => r.status === 'fired').length
    expect(fired).toBeGreaterThanOrEqual(answered)
    const { rows: [v] } = await testDb().query('select firings_total, firings_since_service, firings_since_requalification from vessels where id = $1', [vessel.id])
    expect(v).toEqual({ firings_total: fired, firings_since_service: fired, firings_since_requalification: fired })
    const mine = reconcileReport().vessels.find(x => x.id === vessel.id)!
    expect(mine.mismatches).toEqual([])
  })

  it('keeps all 500 rows of an import or none when killed during its commit', async () => {
    const vessel = await newVessel()
    const plan = await newPlan(vessel.id, await as('analyst'))
    // 0.8 g of a sample declared at 26 454 J/g (NIST SRM 39j, weighed in air) on 10 cm of Ni-Cr wire: clear.
    const csv = ['sample_code,material,mass_g,heating_value_j_per_g,fuse_wire,fuse_length_cm',
      ...Array.from({ length: 500 }, (_, i) => `${unique('C')}-${i},,0.8,26454,nichrome,10`)].join('\n')
    const server = await ownServer()
    const cookie = await signInAt(server.baseURL)
    const request = fetch(`${server.baseURL}/api/plans/${plan.id}/import`, {
      method: 'POST', headers: { 'cookie': cookie, 'content-type': 'application/json' }, body: JSON.stringify({ csv, commit: true }),
    }).then(r => r.status, () => 'killed')
    // Kill as soon as the import's transaction is writing runs (or, if it is quicker than the probe, just after it).
    await until(async () => {
      const { rows } = await testDb().query(`select 1 from pg_stat_activity where datname = current_database() and query ilike 'insert into "runs"%' and pid <> pg_backend_pid()`)
      return rows.length > 0
    }, 20_000)
    await server.kill()
    const status = await request

    await ownServer()
    const { rows: [n] } = await testDb().query('select count(*)::int as n from runs where plan_id = $1', [plan.id])
    expect([0, 500], `answer ${status}, ${n.n} runs`).toContain(n.n)
    if (status === 201 || status === 200) expect(n.n).toBe(500)
  })
})
