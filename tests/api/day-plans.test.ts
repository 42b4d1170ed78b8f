import { beforeAll, describe, expect, it } from 'vitest'
import { as, call } from '../support/api'
import { auditRows, testDb } from '../support/db'
import { material, newPlan, newVessel } from '../support/factories'
import { newClient, receive } from '../support/samples'

// Lab policy defaults: 2 determinations per sample, 20 min per firing cycle, 8 h bench day from 08:00 UTC
// (the lab's own estimates) → 24 firing cycles; 5 standardisation runs per series (ISO 1928, from memory).
const day = new Date(Date.now() + 86_400_000).toISOString().slice(0, 10)
let A: { id: string, name: string }, B: { id: string, name: string }, C: { id: string }, D: { id: string }
let myRuns: string[] = []
let myVerdicts: string[] = []
let vesselIds: string[]

interface Firing { runId: string | null, kind: string, order: number, why: string }
interface VesselDay { vesselId: string, capacity: number, firings: Firing[], note: string }
interface Answer { vessels: VesselDay[], leftovers: { runId: string, reason: string }[], problems: { runId: string, message: string }[], forecasts: Record<string, { dueAt: string, by: string }> }

const propose = async (assignment?: Record<string, string[]>, on = day) => call<Answer>('POST', '/api/day-plans/proposal', { cookie: await as('analyst'), body: { day: on, vesselIds, ...(assignment ? { assignment } : {}) } })
const on = (a: Answer, id: string) => a.vessels.find(v => v.vesselId === id)!

beforeAll(async () => {
  A = await newVessel()
  B = await newVessel({ initialFiringsSinceService: 494, initialFiringsSinceRequalification: 494, initialFiringsTotal: 494 })
  C = await newVessel({ initialCondition: 'away' })
  D = await newVessel({ initialCondition: 'awaiting-verification' })
  vesselIds = [A.id, B.id, C.id, D.id]
  const client = await newClient()
  const oats = await material('Rolled oat flakes')
  // Twelve samples received ten days ago, so that they are the oldest in the queue and placed first.
  const samples = []
  for (let i = 0; i < 12; i++) samples.push(await receive(client.id, { materialId: oats.id, receivedAt: new Date(Date.now() - (10 * 86_400_000) + i * 60_000).toISOString() }))
  const plan = await newPlan(A.id)
  const res = await call('POST', `/api/plans/${plan.id}/from-samples`, { cookie: await as('analyst'), body: { sampleIds: samples.map(s => s.id) } })
  expect(res.status).toBe(201)
  myRuns = res.body.runs.map((r: { id: string }) => r.id)
  myVerdicts = res.body.runs.map((r: { verdict: string }) => r.verdict)
})

describe('day plan', () => {
  it('gives nothing to a vessel away, only the reference standard to one awaiting verification, and standardisation first without an energy equivalent', async () => {
    const { status, body } = await propose()
    expect(status).toBe(200)
    expect(body.problems).toEqual([])
    expect(on(body, C.id).firings).toEqual([])
    expect(on(body, C.id).note).toMatch(/takes nothing that day/)
    // D was serviced but never standardised: a check needs an energy equivalent, so the series comes first (lab policy: 5 runs).
    expect(on(body, D.id).firings.map(f => f.kind)).toEqual(Array(5).fill('standardisation'))
    expect(on(body, A.id).firings.slice(0, 5).map(f => [f.kind, f.runId])).toEqual(Array(5).fill(['standardisation', null]))
    expect(on(body, A.id).firings[0]!.why).toMatch(/No energy equivalent on record/)
    // A library material's identity counts in the proposal as on the run page: clear runs need no signature there either.
    expect(myVerdicts.every(v => v === 'clear')).toBe(true)
    expect(on(body, A.id).firings.filter(f => f.runId && myRuns.includes(f.runId)).map(f => (f as Firing & { needsSignature: boolean }).needsSignature)).not.toContain(true)
  })

  it('never crosses a vessel\'s service limit: 6 firings left → at most 6, and what does not fit stays with a reason', async () => {
    const { body } = await propose()
    // B: 500 − 494 = 6 firings before routine service (common practice interval, lab policy).
    expect(on(body, B.id).capacity).toBe(6)
    expect(on(body, B.id).firings.length).toBeLessThanOrEqual(6)
    // A: 24 cycles − 5 standardisation = 19 sample firings; B: 1. 24 runs → 4 stay in the queue.
    const placed = body.vessels.flatMap(v => v.firings.map(f => f.runId)).filter(id => id && myRuns.includes(id))
    const left = body.leftovers.filter(l => myRuns.includes(l.runId))
    expect(placed.length + left.length).toBe(24)
    expect(left.length).toBe(4)
    expect(left[0]!.reason).toMatch(/full that day/)
    // Duplicates together where possible: the first sample's two runs are next to each other on one vessel.
    const a = on(body, A.id).firings.filter(f => f.runId)
    expect(a[0]!.why).toMatch(/All 2 determinations on/)
  })

  it('re-checks a move at once against the new vessel', async () => {
    const { body } = await propose()
    const assignment = Object.fromEntries(body.vessels.map(v => [v.vesselId, v.firings.flatMap(f => (f.runId ? [f.runId] : []))]))
    const moved = assignment[A.id]!.shift()!
    assignment[C.id] = [moved]
    const res = await propose(assignment)
    expect(res.body.problems.map(p => p.message)).toEqual([expect.stringMatching(/may not fire/)])
    assignment[C.id] = []
    assignment[B.id] = [...assignment[B.id]!, moved]
    expect((await propose(assignment)).body.problems[0]!.message).toMatch(/has 6 firings that day/)
  })

  it('accepts a plan: runs take their vessel and order in one transaction, with audit rows; a plan with problems changes nothing', async () => {
    const { body } = await propose()
    const assignment = Object.fromEntries(body.vessels.map(v => [v.vesselId, v.firings.flatMap(f => (f.runId ? [f.runId] : []))]))
    const bad = { ...assignment, [C.id]: [assignment[A.id]![0]!] }
    const refused = await call('POST', '/api/day-plans', { cookie: await as('analyst'), body: { day, vesselIds, assignment: bad } })
    expect(refused.status).toBe(422)
    const { rows: before } = await testDb().query('select count(*)::int as n from runs where day_plan_id is not null and vessel_id = any($1)', [vesselIds])
    expect(before[0].n).toBe(0)
    expect((await call('POST', '/api/day-plans', { cookie: await as('supervisor'), body: { day, vesselIds, assignment } })).status).toBe(403)
    const ok = await call('POST', '/api/day-plans', { cookie: await as('analyst'), body: { day, vesselIds, assignment } })
    expect(ok.status, JSON.stringify(ok.body).slice(0, 500)).toBe(201)
    const onB = assignment[B.id]!
    expect(onB.length).toBeGreaterThan(0)
    const { rows } = await testDb().query('select id, vessel_id, day_order, day_plan_id from runs where id = any($1)', [onB])
    for (const r of rows) expect(r).toMatchObject({ vessel_id: B.id, day_plan_id: ok.body.id })
    // After the five standardisation firings, B's sample run is sixth.
    expect(rows.map(r => r.day_order)).toEqual([6])
    expect(await auditRows({ action: 'run.schedule', entityId: onB[0] })).toHaveLength(1)
    expect(await auditRows({ action: 'day-plan.accept', entityId: ok.body.id })).toHaveLength(1)
    // Accepted runs leave the planning pool; B is due for service on that day at this pace.
    const after = await propose()
    expect(after.body.vessels.flatMap(v => v.firings.map(f => f.runId)).filter(id => id && onB.includes(id))).toEqual([])
    expect(on(after.body, B.id).capacity).toBe(0)
    expect(after.body.forecasts[B.id]).toMatchObject({ by: 'firings', dueAt: `${day}T00:00:00.000Z` })
    // The fleet page's forecast counts the accepted day plan too (6 firings planned on a vessel with 6 left).
    const fleet = await call('GET', '/api/fleet', { cookie: await as('technician') })
    const b = fleet.body.vessels.find((v: { id: string }) => v.id === B.id)
    expect(b.forecast.dayPlans).toMatchObject({ dueAt: `${day}T00:00:00.000Z`, plannedFirings: 6 })
  })

  it('accepts the same runs once when two analysts accept at the same moment', async () => {
    const client = await newClient()
    const s = await receive(client.id, { materialId: (await material('Rolled oat flakes')).id, receivedAt: new Date(Date.now() - 20 * 86_400_000).toISOString() })
    const plan = await newPlan(A.id)
    await call('POST', `/api/plans/${plan.id}/from-samples`, { cookie: await as('analyst'), body: { sampleIds: [s.id] } })
    // The day after: the first day is full on A and B.
    const next = new Date(Date.parse(`${day}T00:00:00Z`) + 86_400_000).toISOString().slice(0, 10)
    const { body } = await propose(undefined, next)
    const assignment = Object.fromEntries(body.vessels.map(v => [v.vesselId, v.firings.flatMap(f => (f.runId ? [f.runId] : []))]))
    expect(Object.values(assignment).flat().length).toBeGreaterThan(0)
    const [x, y] = await Promise.all([
      call('POST', '/api/day-plans', { cookie: await as('analyst'), body: { day: next, vesselIds, assignment } }),
      call('POST', '/api/day-plans', { cookie: await as('analyst2'), body: { day: next, vesselIds, assignment } }),
    ])
    expect([x.status, y.status].sort()).toEqual([201, 422])
    // A day plan with nothing to fire (no run placed, and no check a vessel starts with) is nothing to accept.
    const empty = await call('POST', '/api/day-plans', { cookie: await as('analyst'), body: { day: next, vesselIds: [C.id], assignment: {} } })
    expect(empty.status).toBe(422)
    expect(empty.body.data.fields[0].path).toBe('assignment')
  })

  it('names the bad fields', async () => {
    const res = await call('POST', '/api/day-plans/proposal', { cookie: await as('analyst'), body: { day: '2026-02-30', vesselIds: [] } })
    expect(res.status).toBe(422)
    expect(res.body.data.fields.map((f: { path: string }) => f.path).sort()).toEqual(['day', 'vesselIds'])
  })
})
