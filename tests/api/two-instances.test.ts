import { spawnSync } from 'node:child_process'
import { randomUUID } from 'node:crypto'
import { fileURLToPath } from 'node:url'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { baseURL, DEMO_PASSWORD, sessionCookie } from '../support/api'
import { testDb } from '../support/db'
import { startServer } from '../support/server-process'
import type { ServerProcess } from '../support/server-process'
import { readyRuns, registerVessel } from '../unit/bench/bench-api'

// Two app instances on one PostgreSQL: firings sent through both at once count exactly once
// each, and a retry with the same Idempotency-Key on the OTHER instance gets the first answer and counts nothing —
// so no instance may keep counters, keys or sessions in its own memory. Reminders-once is in reminders.test.ts.

const root = fileURLToPath(new URL('../..', import.meta.url))
const RUNS = 30

let second: ServerProcess
beforeAll(async () => {
  second = await startServer()
})
afterAll(async () => {
  await second?.stop()
})

async function signInAt(base: string) {
  const res = await fetch(`${base}/api/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email: 'analyst@emberline.test', password: DEMO_PASSWORD }) })
  expect(res.status).toBe(200)
  return sessionCookie(res.headers)
}

async function fireAt(base: string, cookie: string, runId: string, key: string) {
  const res = await fetch(`${base}/api/runs/${runId}/firing`, {
    method: 'POST',
    headers: { 'cookie': cookie, 'content-type': 'application/json', 'idempotency-key': key },
    body: JSON.stringify({ outcome: 'complete', weighedMassG: 1 }),
  })
  return { status: res.status, body: await res.json(), replayed: res.headers.get('idempotent-replayed') }
}

describe('two instances on one database', () => {
  it('counts 30 firings split across both instances exactly once, and answers replays on the other instance', async () => {
    const vessel = await registerVessel()
    const runs = await readyRuns(vessel.id, Array.from({ length: RUNS }, () => ({})))
    // A session made on one instance is honoured by the other (sessions are sealed cookies, not process memory).
    const cookie = await signInAt(baseURL())
    const bases = [baseURL(), second.baseURL]
    const keys = runs.map(() => randomUUID())

    const firsts = await Promise.all(runs.map((r, i) => fireAt(bases[i % 2]!, cookie, r.id, keys[i]!)))
    for (const f of firsts) expect(f.status, JSON.stringify(f.body)).toBe(201)

    // Every third key is retried on the instance that did NOT record it, all at once.
    const replayIdx = runs.map((_, i) => i).filter(i => i % 3 === 0)
    const replays = await Promise.all(replayIdx.map(i => fireAt(bases[(i + 1) % 2]!, cookie, runs[i]!.id, keys[i]!)))
    for (const [n, i] of replayIdx.entries()) {
      expect(replays[n]!.status).toBe(201)
      expect(replays[n]!.replayed).toBe('true')
      expect(replays[n]!.body).toEqual(firsts[i]!.body)
    }

    const { rows: [v] } = await testDb().query('select firings_total, firings_since_service, firings_since_requalification from vessels where id = $1', [vessel.id])
    expect(v).toEqual({ firings_total: RUNS, firings_since_service: RUNS, firings_since_requalification: RUNS })
    const { rows: [f] } = await testDb().query('select count(*)::int as n, count(distinct run_id)::int as runs from firings where vessel_id = $1', [vessel.id])
    expect(f).toEqual({ n: RUNS, runs: RUNS })
    // Every firing's answer carries the vessel's counters after it: 30 distinct values 1…30, none lost or repeated.
    expect(firsts.map(x => x.body.vessel.firingsTotal).sort((a, b) => a - b)).toEqual(Array.from({ length: RUNS }, (_, i) => i + 1))

    // The lab's reconcile command agrees: counters equal the firings recorded.
    const res = spawnSync('npx', ['tsx', 'scripts/reconcile.ts', '--json'], { cwd: root, env: process.env, encoding: 'utf8', timeout: 60_000 })
    const mine = JSON.parse(res.stdout).vessels.find((x: { id: string }) => x.id === vessel.id)
    expect(mine.mismatches).toEqual([])
    expect(mine.checks.map((c: { recorded: number, expected: number }) => [c.recorded, c.expected])).toEqual([[RUNS, RUNS], [RUNS, RUNS], [RUNS, RUNS]])
  })
})
