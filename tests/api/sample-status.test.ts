import { beforeAll, describe, expect, it } from 'vitest'
import { as, call, DEMO_PASSWORD } from '../support/api'
import { auditRows, testDb } from '../support/db'
import { newPlan } from '../support/factories'
import { newClient, receive } from '../support/samples'
import { BA_J_PER_G, FUSE_10CM_J, PASSWORD, benzoicAcidId, enterResult, fire, readyRuns, standardisedVessel } from '../unit/bench/bench-api'

// A received sample's state follows its runs: planned → tested once its determinations are fired with a result
// (duplicates by default, lab policy; ISO 1928 reports the mean of duplicates, from memory) → reported at the certificate.
// Benzoic acid as the unknown: 26 454 J/g weighed in air (NIST SRM 39j certificate); ε = 10 000 J/K (as results.test.ts).
const EPS = 10_000
let vesselId: string
let ba: string
let client: { id: string }

beforeAll(async () => {
  vesselId = (await standardisedVessel([10_000, 10_005, 9_995, 10_002, 9_998])).vessel.id
  ba = await benzoicAcidId()
  client = await newClient()
})

interface Run { id: string, seq: number, status: string, components: { role: string, massG?: number }[] }
const massOf = (r: Run) => r.components.find(c => c.role === 'sample')!.massG!
const sampleStatus = async (id: string) => (await call('GET', `/api/samples/${id}`, { cookie: await as('analyst') })).body.status as string

/** A received sample planned into a submitted plan on the standardised vessel: its runs, ready to fire. */
async function plannedSample() {
  const s = await receive(client.id, { materialId: ba, description: 'Benzoic acid pellets, as received' })
  const plan = await newPlan(vesselId)
  const planned = await call('POST', `/api/plans/${plan.id}/from-samples`, { cookie: await as('analyst'), body: { sampleIds: [s.id] } })
  expect(planned.status, JSON.stringify(planned.body)).toBe(201)
  const submitted = await call('POST', `/api/plans/${plan.id}/submit`, { cookie: await as('analyst'), body: {} })
  expect(submitted.body.runs.map((r: Run) => r.status)).toEqual(['ready', 'ready'])
  return { sample: s, planId: plan.id as string, runs: planned.body.runs as Run[] }
}

describe('sample status from its runs', () => {
  it('stays planned until both determinations gave a result (a misfire needs a repeat), then is tested, then reported', async () => {
    const { sample, planId, runs } = await plannedSample()
    const [a, b] = runs as [Run, Run]
    expect((await fire(a.id, { weighedMassG: massOf(a) })).status).toBe(201)
    expect(await sampleStatus(sample.id)).toBe('planned')
    expect((await fire(b.id, { weighedMassG: massOf(b), outcome: 'misfire' })).status).toBe(201)
    // One of two determinations has a result: still planned, and nothing recorded as tested.
    expect(await sampleStatus(sample.id)).toBe('planned')
    expect(await auditRows({ action: 'sample.tested', entityId: sample.id })).toEqual([])

    // The repeat carries the sample, so its firing counts for it.
    const repeat = await call('POST', `/api/runs/${b.id}/duplicate`, { cookie: await as('analyst'), body: {} })
    expect(repeat.status).toBe(201)
    await call('POST', `/api/plans/${planId}/submit`, { cookie: await as('analyst'), body: {} })
    expect((await fire(repeat.body.id, { weighedMassG: massOf(a) })).status).toBe(201)
    expect(await sampleStatus(sample.id)).toBe('tested')
    const tested = await auditRows({ action: 'sample.tested', entityId: sample.id })
    expect(tested).toHaveLength(1)
    expect(tested[0]).toMatchObject({ old_values: { status: 'planned' }, new_values: { status: 'tested' } })

    // Results, signatures and the certificate: reported.
    for (const r of [a.id, repeat.body.id]) {
      const res = await enterResult(r, { temperatureRiseK: (massOf(a) * BA_J_PER_G + FUSE_10CM_J) / EPS, fuse: { wire: 'nichrome', burntLengthCm: 10 }, moistureAdPct: 0 })
      expect(res.status, JSON.stringify(res.body)).toBe(201)
      expect((await call('POST', `/api/results/${res.body.result.id}/sign`, { cookie: await as('supervisor'), body: { password: PASSWORD, reason: 'checked' } })).status).toBe(200)
    }
    expect(await sampleStatus(sample.id)).toBe('tested')
    const issued = await call('POST', '/api/reports', { cookie: await as('supervisor'), body: { sampleCode: sample.labCode } })
    expect(issued.status, JSON.stringify(issued.body)).toBe(201)
    expect(await sampleStatus(sample.id)).toBe('reported')
    expect((await auditRows({ action: 'sample.report', entityId: sample.id }))[0]).toMatchObject({ old_values: { status: 'tested' } })
    // The sample page lists each run's firing and result, and the certificate for the roles that may download it.
    const page = (await call('GET', `/api/samples/${sample.id}`, { cookie: await as('analyst') })).body
    expect(page.runs.map((r: { outcome: string | null, result: { status: string } | null }) => [r.outcome, r.result?.status ?? null])).toEqual([['complete', 'signed'], ['misfire', null], ['complete', 'signed']])
    expect(page.reports).toEqual([expect.objectContaining({ reportNumber: issued.body.reportNumber, download: issued.body.download })])
    expect((await call('GET', `/api/samples/${sample.id}`, { cookie: await as('technician') })).body.reports).toEqual([])
  })

  it('counts a single planned determination once its repeat after a misfire gives a result', async () => {
    // The lab's policy asks duplicates; the analyst planned one determination for this sample.
    const s = await receive(client.id, { materialId: ba, description: 'Benzoic acid pellets, one determination' })
    const plan = await newPlan(vesselId)
    const planned = await call('POST', `/api/plans/${plan.id}/from-samples`, { cookie: await as('analyst'), body: { sampleIds: [s.id], determinations: 1 } })
    expect(planned.status, JSON.stringify(planned.body)).toBe(201)
    const [only] = planned.body.runs as [Run]
    await call('POST', `/api/plans/${plan.id}/submit`, { cookie: await as('analyst'), body: {} })
    expect((await fire(only.id, { weighedMassG: massOf(only), outcome: 'misfire' })).status).toBe(201)
    expect(await sampleStatus(s.id)).toBe('planned')
    const repeat = await call('POST', `/api/runs/${only.id}/duplicate`, { cookie: await as('analyst'), body: {} })
    expect(repeat.status).toBe(201)
    await call('POST', `/api/plans/${plan.id}/submit`, { cookie: await as('analyst'), body: {} })
    expect((await fire(repeat.body.id, { weighedMassG: massOf(only) })).status).toBe(201)
    // Two runs, one result: the one determination planned is done (before, the repeat counted as a second one asked for).
    expect(await sampleStatus(s.id)).toBe('tested')
    const { rows } = await testDb().query(`select determinations from samples where id = $1`, [s.id])
    expect(rows[0].determinations).toBe(1)
  })

  it('does not count a withdrawn run; a repeat planned after testing sends the sample back to planned', async () => {
    const { sample, runs } = await plannedSample()
    const [a, b] = runs as [Run, Run]
    expect((await fire(a.id, { weighedMassG: massOf(a) })).status).toBe(201)
    expect(await sampleStatus(sample.id)).toBe('planned')
    const withdrawn = await call('POST', `/api/runs/${b.id}/withdraw`, { cookie: await as('analyst'), body: { reason: 'sample used up' } })
    expect(withdrawn.status).toBe(200)
    expect(await sampleStatus(sample.id)).toBe('tested')
    expect((await auditRows({ action: 'sample.tested', entityId: sample.id }))[0]!.new_values.act).toMatch(/withdrawal/)
    // A further determination is planned after all: the sample has a run to fire again.
    expect((await call('POST', `/api/runs/${a.id}/duplicate`, { cookie: await as('analyst'), body: {} })).status).toBe(201)
    expect(await sampleStatus(sample.id)).toBe('planned')
    expect(await auditRows({ action: 'sample.reopen', entityId: sample.id })).toHaveLength(1)
  })
})

/** A standardised vessel after a routine service: awaiting verification, so its day starts with a check run. */
async function servicedVessel() {
  const { vessel } = await standardisedVessel([10_000, 10_005, 9_995, 10_002, 9_998])
  const serviced = await call('POST', `/api/vessels/${vessel.id}/services`, {
    cookie: await as('technician'),
    body: {
      kind: 'routine', performedAt: new Date(Date.now() - 3_600_000).toISOString(), password: DEMO_PASSWORD,
      seals: [{ position: 'head', name: 'Head O-ring', renewed: true, lot: 'HO-1' }, { position: 'valve', name: 'Valve seal', renewed: true, lot: 'VS-1' }, { position: 'electrode', name: 'Electrode seal', renewed: true, lot: 'ES-1' }],
      // 12 N·m typical packing nut torque; 3.0 MPa usual fill (common practice).
      valveSeatRenewed: true, electrodeInsulators: 'inspected', packingNutTorqueNm: 12, electrodeResistanceOhm: 1.5, leakTest: { passed: true, pressureMPa: 3.0 },
      sealingSurfaces: 'good', threads: 'good', partsUsed: [], notes: '',
    },
  })
  expect(serviced.status, JSON.stringify(serviced.body)).toBe(201)
  return vessel
}

describe('check runs of an accepted day plan', () => {
  it('takes a check run already waiting on the vessel instead of planning the reference standard twice', async () => {
    const vessel = await servicedVessel()
    const [waiting] = await readyRuns(vessel.id, [{ kind: 'check', massG: 1 }])
    const day = new Date(Date.now() + 4 * 86_400_000).toISOString().slice(0, 10)
    const accepted = await call('POST', '/api/day-plans', { cookie: await as('analyst'), body: { day, vesselIds: [vessel.id], assignment: { [vessel.id]: [] } } })
    expect(accepted.status, JSON.stringify(accepted.body)).toBe(201)
    expect(accepted.body.vessels[0].firings.map((f: { runId: string }) => f.runId)).toEqual([waiting!.id])
    expect(await auditRows({ action: 'run.schedule', entityId: waiting!.id })).toHaveLength(1)
    const { rows } = await testDb().query(`select count(*)::int as n from runs where vessel_id = $1 and kind = 'check'`, [vessel.id])
    expect(rows[0].n).toBe(1)
  })

  it('plans the check once when two analysts accept the same day at the same moment', async () => {
    const vessel = await servicedVessel()
    const day = new Date(Date.now() + 5 * 86_400_000).toISOString().slice(0, 10)
    const body = { day, vesselIds: [vessel.id], assignment: { [vessel.id]: [] } }
    const answers = await Promise.all([as('analyst'), as('analyst2')].map(async cookie => call('POST', '/api/day-plans', { cookie: await cookie, body })))
    expect(answers.map(a => a.status).sort()).toEqual([201, 422])
    const { rows } = await testDb().query(`select count(*)::int as n from runs where vessel_id = $1 and kind = 'check'`, [vessel.id])
    expect(rows[0].n).toBe(1)
  })

  it('creates the check run a serviced vessel starts with: benzoic acid at the suggested mass, numbered, on the day plan, ready to fire', async () => {
    const vessel = await servicedVessel()
    const day = new Date(Date.now() + 3 * 86_400_000).toISOString().slice(0, 10)
    const proposal = await call('POST', '/api/day-plans/proposal', { cookie: await as('analyst'), body: { day, vesselIds: [vessel.id] } })
    expect(proposal.body.vessels[0].firings.map((f: { kind: string, runId: string | null }) => [f.kind, f.runId])).toEqual([['check', null]])
    // Only the check slot: the vessel fires nothing else until it passes, so the plan has no sample run to place.
    const accepted = await call('POST', '/api/day-plans', { cookie: await as('analyst'), body: { day, vesselIds: [vessel.id], assignment: { [vessel.id]: [] } } })
    expect(accepted.status, JSON.stringify(accepted.body)).toBe(201)
    const runId = accepted.body.vessels[0].firings[0].runId as string
    expect(runId).toMatch(/^[0-9a-f-]{36}$/)
    const run = (await call('GET', `/api/runs/${runId}`, { cookie: await as('analyst') })).body
    expect(run).toMatchObject({ kind: 'check', status: 'ready', vesselId: vessel.id, sampleCode: `CHK-${day}-${vessel.name}` })
    expect(run.components[0]).toMatchObject({ role: 'sample', materialId: ba })
    // The suggested mass releases the lab's target energy: about 1 g of benzoic acid at 26 454 J/g (NIST SRM 39j).
    expect(run.components[0].massG).toBeGreaterThan(0.5)
    expect(run.components[0].massG).toBeLessThan(1.5)
    expect(await auditRows({ action: 'run.create', entityId: runId })).toHaveLength(1)
    // It counts once on the day (as a run, not as a slot too) and fires like any run.
    const again = await call('POST', '/api/day-plans/proposal', { cookie: await as('analyst'), body: { day, vesselIds: [vessel.id] } })
    expect(again.body.forecasts[vessel.id]).toBeDefined()
    const v = (await call('GET', `/api/vessels/${vessel.id}`, { cookie: await as('analyst') })).body
    expect(v.dayPlanForecast.days).toEqual([{ day, firings: 1 }])
    expect((await fire(runId, { weighedMassG: run.components[0].massG })).status).toBe(201)
    expect((await call('GET', `/api/vessels/${vessel.id}`, { cookie: await as('analyst') })).body.dayPlanForecast.days).toEqual([])
  })
})
