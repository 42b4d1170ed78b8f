import { randomUUID } from 'node:crypto'
import { describe, expect, it } from 'vitest'
import { as, call, unique } from '../support/api'
import { auditRows, testDb } from '../support/db'
import { benzoicAcidId, fire, plannedRuns, readyRuns, registerVessel, standardisedVessel, vessel } from '../unit/bench/bench-api'
import { waitUntil } from '../support/wait'

// POST /api/runs/:id/firing (every recorded firing adds one to each counter in the same
// transaction; two firings at the same instant both count). Runs: 1.0000 g of a sample declared at 26 454 J/g
// (benzoic acid, NIST SRM 39j, weighed in air) and 10 cm Ni-Cr fuse — 26.55 kJ in a 33 kJ vessel, clear.

const counters = (v: { firingsSinceService: number, firingsSinceRequalification: number, firingsTotal: number }) => [v.firingsSinceService, v.firingsSinceRequalification, v.firingsTotal]

async function firingCount(vesselId: string) {
  const { rows } = await testDb().query('select count(*)::int as n from firings where vessel_id = $1', [vesselId])
  return rows[0].n as number
}

describe('recording a firing', () => {
  it('records it, sets the run fired and adds one to all three counters, with its audit row', async () => {
    const v = await registerVessel({ initialFiringsSinceService: 10, initialFiringsSinceRequalification: 120, initialFiringsTotal: 900 })
    const [run] = await readyRuns(v.id, [{}])
    const res = await fire(run!.id, { weighedMassG: 1.0003, observations: 'clean crucible' })
    expect(res.status).toBe(201)
    expect(res.body).toMatchObject({ runId: run!.id, outcome: 'complete', weighedMassG: 1.0003, run: { status: 'fired' }, lockedOut: false })
    expect(counters(res.body.vessel)).toEqual([11, 121, 901])
    expect(counters(await vessel(v.id))).toEqual([11, 121, 901])
    expect((await call('GET', `/api/runs/${run!.id}`, { cookie: await as('analyst') })).body.status).toBe('fired')
    const [row] = await auditRows({ action: 'run.fire', entityId: run!.id })
    expect(row.new_values).toMatchObject({ status: 'fired', firingId: res.body.id, vessel: { firingsTotal: 901 } })
    // Counters reconcile with the records: lifetime = firings at registration + firings recorded.
    const { rows } = await testDb().query('select firings_total - firings_total_at_registration as recorded from vessels where id = $1', [v.id])
    expect(rows[0].recorded).toBe(await firingCount(v.id))
  })

  it('answers a replay of the same key with the first answer and counts nothing', async () => {
    const v = await registerVessel()
    const [run] = await readyRuns(v.id, [{}])
    const key = randomUUID()
    const first = await fire(run!.id, { weighedMassG: 0.9998 }, { key })
    expect(first.status).toBe(201)
    const again = await fire(run!.id, { weighedMassG: 0.9998 }, { key })
    expect(again.status).toBe(201)
    expect(again.headers.get('idempotent-replayed')).toBe('true')
    expect(again.body).toEqual(first.body)
    expect(counters(await vessel(v.id))).toEqual([1, 1, 1])
    expect(await firingCount(v.id)).toBe(1)
    // The same key for a different request is refused, naming the header.
    const other = await fire(run!.id, { weighedMassG: 1.2 }, { key })
    expect(other.status).toBe(422)
    expect(other.body.data.fields[0].path).toBe('Idempotency-Key')
  })

  it('counts 40 firings of 40 ready runs posted at once exactly 40 times, and their 40 replays not at all', async () => {
    const v = await registerVessel()
    const runs = await readyRuns(v.id, Array.from({ length: 40 }, () => ({})))
    const keys = runs.map(() => randomUUID())
    const answers = await Promise.all(runs.map((r, i) => fire(r.id, { weighedMassG: 1 }, { key: keys[i] })))
    expect(answers.map(a => a.status)).toEqual(Array(40).fill(201))
    expect(counters(await vessel(v.id))).toEqual([40, 40, 40])
    expect(await firingCount(v.id)).toBe(40)
    const replays = await Promise.all(runs.map((r, i) => fire(r.id, { weighedMassG: 1 }, { key: keys[i] })))
    expect(replays.map(a => a.status)).toEqual(Array(40).fill(201))
    expect(replays.map(a => a.body.id)).toEqual(answers.map(a => a.body.id))
    expect(counters(await vessel(v.id))).toEqual([40, 40, 40])
    expect(await firingCount(v.id)).toBe(40)
  })

  it('turns two identical requests at the same instant into one firing', async () => {
    const v = await registerVessel()
    const [run] = await readyRuns(v.id, [{}])
    const key = randomUUID()
    const [a, b] = await Promise.all([fire(run!.id, {}, { key }), fire(run!.id, {}, { key })])
    expect([a.status, b.status]).toEqual([201, 201])
    expect(a.body.id).toBe(b.body.id)
    expect(await firingCount(v.id)).toBe(1)
    expect(counters(await vessel(v.id))).toEqual([1, 1, 1])
  })
})

describe('refusals (nothing is recorded or counted)', () => {
  it('400 without the Idempotency-Key header, naming it', async () => {
    const v = await registerVessel()
    const [run] = await readyRuns(v.id, [{}])
    const res = await fire(run!.id, {}, { key: null })
    expect(res.status).toBe(400)
    expect(res.body.message).toContain('Idempotency-Key')
    expect(res.body.data.fields[0].path).toBe('Idempotency-Key')
    expect(await firingCount(v.id)).toBe(0)
  })

  it('403 for a role other than analyst, 422 for a bad outcome or mass', async () => {
    const v = await registerVessel()
    const [run] = await readyRuns(v.id, [{}])
    expect((await fire(run!.id, {}, { cookie: await as('supervisor') })).status).toBe(403)
    const bad = await fire(run!.id, { outcome: 'exploded', weighedMassG: -1 })
    expect(bad.status).toBe(422)
    expect(bad.body.data.fields.map((f: { path: string }) => f.path).sort()).toEqual(['outcome', 'weighedMassG'])
    expect(await firingCount(v.id)).toBe(0)
  })

  it('409 when the run is not ready (a draft, an already fired run)', async () => {
    const v = await registerVessel()
    const plan = await call('POST', '/api/plans', { cookie: await as('analyst'), body: { name: unique('p'), vesselId: v.id, fillPressureMPa: 3 } })
    const draft = await call('POST', `/api/plans/${plan.body.id}/runs`, { cookie: await as('analyst'), body: { sampleCode: unique('D'), components: [{ role: 'sample', name: 'x', massG: 1, heatingValueJPerG: 26_454, smiles: 'OC(=O)c1ccccc1' }] } })
    const res = await fire(draft.body.id)
    expect(res.status).toBe(409)
    expect(res.body.message).toMatch(/draft/)
    const [run] = await readyRuns(v.id, [{}])
    expect((await fire(run!.id)).status).toBe(201)
    const twice = await fire(run!.id)
    expect(twice.status).toBe(409)
    expect(twice.body.message).toMatch(/already been fired/)
    expect(await firingCount(v.id)).toBe(1)
  })

  it('409 with the state\'s reason on an overdue vessel (the 501st firing of a 501-firing interval registered at 500)', async () => {
    // Common practice service interval; here 501 so that the vessel registered at 500 is only "due".
    const v = await registerVessel({ initialFiringsSinceService: 500, initialFiringsSinceRequalification: 500, initialFiringsTotal: 500, serviceIntervalFirings: 501 })
    expect(v.state).toBe('service-due')
    const [first, second] = await readyRuns(v.id, [{}, {}])
    expect((await fire(first!.id)).status).toBe(201)
    expect((await vessel(v.id)).state).toBe('overdue')
    const res = await fire(second!.id)
    expect(res.status).toBe(409)
    expect(res.body.message).toMatch(/Routine service is overdue: 501 firings/)
    expect(res.body.data.state).toBe('overdue')
    expect(counters(await vessel(v.id))).toEqual([501, 501, 501])
  })

  it('409 when the weighed mass creates a block: the run becomes blocked and the message says what changed', async () => {
    const v = await registerVessel()
    const [run] = await readyRuns(v.id, [{ massG: 1 }])
    // 1.4500 g × 26 454 J/g + 96 J = 38.45 kJ, above the 33 kJ rating: a block.
    const res = await fire(run!.id, { weighedMassG: 1.45 })
    expect(res.status).toBe(409)
    expect(res.body.message).toContain('sample mass 1.0000 g planned, 1.4500 g weighed')
    expect(res.body.data).toMatchObject({ status: 'blocked' })
    expect(res.body.data.findings.map((f: { code: string }) => f.code)).toContain('energy-over-rating')
    expect((await call('GET', `/api/runs/${run!.id}`, { cookie: await as('analyst') })).body.status).toBe('blocked')
    expect(await firingCount(v.id)).toBe(0)
    expect(counters(await vessel(v.id))).toEqual([0, 0, 0])
    expect(await auditRows({ action: 'run.reassessed-at-firing', entityId: run!.id })).toHaveLength(1)
  })

  it('409 when the weighed mass raises a new approval finding: the run goes back for a signature and supervisors are mailed', async () => {
    const v = await registerVessel()
    const [run] = await readyRuns(v.id, [{ massG: 1, sampleCode: unique('APPR') }])
    // 1.1500 g × 26 454 J/g + 96 J = 30.52 kJ, above 90 % of 33 kJ (29.7 kJ): needs approval (policy).
    const res = await fire(run!.id, { weighedMassG: 1.15 })
    expect(res.status).toBe(409)
    expect(res.body.message).toMatch(/supervisor's signature/)
    expect((await call('GET', `/api/runs/${run!.id}`, { cookie: await as('analyst') })).body.status).toBe('awaiting-approval')
    const { rows } = await testDb().query('select * from mail_outbox where dedupe_key like $1', [`run-reapproval:${run!.id}:%`])
    expect(rows).toHaveLength(1)
    expect(rows[0].to).toContain('supervisor@emberline.test')
    expect(await firingCount(v.id)).toBe(0)
  })
})

describe('a leak or an overpressure locks the vessel out', () => {
  it('locks it, mails supervisors and technicians once, shows on the vessel lists and refuses the next firing', async () => {
    const v = await registerVessel()
    const [leaky, next] = await readyRuns(v.id, [{}, {}])
    const key = randomUUID()
    const res = await fire(leaky!.id, { outcome: 'leak', observations: 'bubbles at the valve during the firing' }, { key })
    expect(res.status).toBe(201)
    expect(res.body.lockedOut).toBe(true)
    expect(res.body.vessel).toMatchObject({ state: 'locked-out', condition: 'locked-out', blocksAllFirings: true })
    expect(counters(res.body.vessel)).toEqual([1, 1, 1])
    // A replay does not lock, count or mail again.
    expect((await fire(leaky!.id, { outcome: 'leak', observations: 'bubbles at the valve during the firing' }, { key })).body.id).toBe(res.body.id)

    const listed = (await call('GET', '/api/vessels', { cookie: await as('analyst') })).body.find((x: { id: string }) => x.id === v.id)
    expect(listed.state).toBe('locked-out')
    expect(listed.conditionReason).toMatch(/Leak on firing/)
    const bench = (await call('GET', '/api/results/bench', { cookie: await as('analyst') })).body.vessels.find((x: { id: string }) => x.id === v.id)
    expect(bench.state).toBe('locked-out')
    expect((await auditRows({ action: 'vessel.lock-out', entityId: v.id }))).toHaveLength(1)

    const refused = await fire(next!.id)
    expect(refused.status).toBe(409)
    expect(refused.body.message).toMatch(/locked out/)
    expect(await firingCount(v.id)).toBe(1)

    const subject = `Vessel ${v.name} locked out: leak on firing of ${leaky!.sampleCode}`
    const mails = await waitUntil('the lock-out mail', async () => {
      const { rows } = await testDb().query('select * from captured_mail where subject = $1', [subject])
      return rows.length ? rows : null
    })
    expect(mails).toHaveLength(1)
    expect(mails[0].to).toEqual(expect.arrayContaining(['supervisor@emberline.test', 'technician@emberline.test']))
    expect(mails[0].text).toContain('bubbles at the valve')
    await new Promise(r => setTimeout(r, 2_000))
    expect((await testDb().query('select count(*)::int as n from captured_mail where subject = $1', [subject])).rows[0].n).toBe(1)
  })

  it('an overpressure locks the vessel out too; misfire and incomplete only count', async () => {
    const v = await registerVessel()
    const [a, b, c] = await readyRuns(v.id, [{}, {}, {}])
    expect((await fire(a!.id, { outcome: 'misfire' })).body.lockedOut).toBe(false)
    expect((await fire(b!.id, { outcome: 'incomplete' })).body.lockedOut).toBe(false)
    const over = await fire(c!.id, { outcome: 'overpressure' })
    expect(over.body.vessel.state).toBe('locked-out')
    expect(counters(await vessel(v.id))).toEqual([3, 3, 3])
  })

  it('a vessel awaiting verification refuses a sample run but fires a check run', async () => {
    // The check run needs an accepted energy equivalent to be evaluated: the vessel is standardised first.
    const { vessel: v } = await standardisedVessel(undefined, { initialCondition: 'awaiting-verification' })
    const runs = await plannedRuns(v.id, [{ kind: 'sample' }, { kind: 'check', materialId: await benzoicAcidId(), massG: 1 }])
    // The plan itself already blocks the sample run (only standardisation/check runs until a check passes).
    expect(runs.map(r => r.status)).toEqual(['blocked', 'ready'])
    expect((await fire(runs[0]!.id)).status).toBe(409)
    expect((await fire(runs[1]!.id)).status).toBe(201)
  })
})
