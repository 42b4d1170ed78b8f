import { describe, expect, it } from 'vitest'
import { as, call, DEMO_PASSWORD, unique } from '../support/api'
import { auditRows, testDb } from '../support/db'
import { benzoicAcidMaterialId } from '../support/factories'

// Intervals and margin are the lab policy defaults of routine service every 500 firings or 182 days
// (six months), requalification after 5,000 firings, "due" within 10 % of an interval — common practice
// (manufacturers' service guidance), no published standard. The electrode resistance limit of 5 Ω is the policy
// default (common practice).
const DAY = 86_400_000
const HOUR = 3_600_000

async function vessel(over: Record<string, unknown> = {}) {
  const res = await call('POST', '/api/vessels', {
    cookie: await as('admin'),
    body: { name: unique('Care'), serialNumber: unique('SN'), class: 'standard', ratedEnergyJ: 33000, maxChargeMassG: 1.5, maxFillPressureMPa: 4.05, volumeMl: 300, ...over },
  })
  expect(res.status).toBe(201)
  return res.body
}

const state = async (id: string) => (await call('GET', `/api/vessels/${id}`, { cookie: await as('analyst') })).body

function routine(over: Record<string, unknown> = {}) {
  return {
    kind: 'routine',
    performedAt: new Date(Date.now() - HOUR).toISOString(),
    password: DEMO_PASSWORD,
    seals: [
      { position: 'head', name: 'Head O-ring', renewed: true, lot: 'HO-1' },
      { position: 'valve', name: 'Inlet valve seal', renewed: true, lot: 'VS-1' },
      { position: 'valve', name: 'Outlet valve seal', renewed: true, lot: 'VS-1' },
      { position: 'electrode', name: 'Electrode seal', renewed: true, lot: 'ES-1' },
    ],
    valveSeatRenewed: true,
    electrodeInsulators: 'inspected',
    // 12 N·m: a typical packing nut torque (common practice).
    packingNutTorqueNm: 12,
    electrodeResistanceOhm: 1.5,
    // 3.0 MPa: the usual oxygen fill (ISO 1928: 3.0 ± 0.2 MPa, from memory).
    leakTest: { passed: true, pressureMPa: 3.0 },
    sealingSurfaces: 'good',
    threads: 'good',
    partsUsed: [{ part: 'Seal kit', lot: 'SK-7', quantity: 1 }],
    notes: '',
    ...over,
  }
}

function requalification(over: Record<string, unknown> = {}) {
  const d = new Date(Date.now() - 2 * DAY).toISOString().slice(0, 10)
  // 20.7 MPa (3,000 psig): hydrostatic test pressure in secondary summaries of ASTM E144.
  return { kind: 'requalification', performedAt: new Date(Date.now() - HOUR).toISOString(), password: DEMO_PASSWORD, body: 'Test house (test)', certificateNumber: unique('CERT'), testPressureMPa: 20.7, testedFrom: d, testedTo: d, passed: true, ...over }
}

async function record(vesselId: string, body: Record<string, unknown>, role: 'technician' | 'analyst' | 'supervisor' | 'admin' = 'technician') {
  return call('POST', `/api/vessels/${vesselId}/services`, { cookie: await as(role), body })
}

async function serviceCount(vesselId: string) {
  const { rows } = await testDb().query('select count(*)::int as n from services where vessel_id = $1', [vesselId])
  return rows[0].n as number
}

describe('service state at each boundary, through the API', () => {
  it('449 firings since service is in service, 450 is due (the 10 % margin), 499 still due, 500 overdue', async () => {
    const at = async (n: number) => (await state((await vessel({ initialFiringsSinceService: n, initialFiringsSinceRequalification: n, initialFiringsTotal: n, lastServicedAt: new Date(Date.now() - DAY).toISOString() })).id)).state
    // 450 = 90 % of 500: the policy defaults (common practice).
    expect(await at(449)).toBe('in-service')
    expect(await at(450)).toBe('service-due')
    expect(await at(499)).toBe('service-due')
    expect(await at(500)).toBe('overdue')
  })

  it('day 163 is in service, day 164 due (90 % of 182 days = 163.8), day 181 due, day 182 overdue', async () => {
    const at = async (days: number) => (await state((await vessel({ lastServicedAt: new Date(Date.now() - days * DAY).toISOString() })).id)).state
    expect(await at(163.7)).toBe('in-service')
    expect(await at(163.9)).toBe('service-due')
    expect(await at(181.9)).toBe('service-due')
    expect(await at(182.01)).toBe('overdue')
  })

  it('4,999 firings since requalification may still be fired; 5,000 is requalification-due and blocks every firing', async () => {
    const four = await state((await vessel({ initialFiringsSinceService: 10, initialFiringsSinceRequalification: 4999, initialFiringsTotal: 6000, lastServicedAt: new Date(Date.now() - DAY).toISOString() })).id)
    expect(four.state).toBe('in-service')
    expect(four.stateReasons.join(' ')).toMatch(/Requalification is due in 1 firing/)
    const five = await state((await vessel({ initialFiringsSinceService: 10, initialFiringsSinceRequalification: 5000, initialFiringsTotal: 6000, lastServicedAt: new Date(Date.now() - DAY).toISOString() })).id)
    expect(five).toMatchObject({ state: 'requalification-due', blocksAllFirings: true })
  })

  it('shows the same state in the fleet as on the vessel', async () => {
    const v = await vessel({ initialFiringsSinceService: 500, initialFiringsSinceRequalification: 500, initialFiringsTotal: 500 })
    const fleet = await call('GET', '/api/fleet', { cookie: await as('technician') })
    expect(fleet.status).toBe(200)
    expect(fleet.body.vessels.find((x: any) => x.id === v.id).state).toBe('overdue')
    expect(fleet.body.queues.attention.vessels.some((x: any) => x.id === v.id)).toBe(true)
  })
})

describe('POST /api/vessels/:id/services — routine seal service', () => {
  it('refuses a routine service that does not renew every seal (422), recording nothing', async () => {
    const v = await vessel({ initialFiringsSinceService: 480, initialFiringsSinceRequalification: 480, initialFiringsTotal: 480 })
    const partial = routine({ seals: routine().seals.map((s, i) => ({ ...s, renewed: i !== 2 })) })
    const res = await record(v.id, partial)
    expect(res.status).toBe(422)
    expect(res.body.data.fields).toContainEqual({ path: 'seals', message: 'a routine service renews every seal together' })
    const noElectrode = await record(v.id, routine({ seals: routine().seals.filter(s => s.position !== 'electrode') }))
    expect(noElectrode.status).toBe(422)
    expect(noElectrode.body.data.fields[0].message).toMatch(/no electrode seal/)
    const noSeat = await record(v.id, routine({ valveSeatRenewed: false }))
    expect(noSeat.status).toBe(422)
    expect(noSeat.body.data.fields.map((f: any) => f.path)).toEqual(['valveSeatRenewed'])
    const after = await state(v.id)
    expect(after).toMatchObject({ firingsSinceService: 480, state: 'service-due' })
    expect(await serviceCount(v.id)).toBe(0)
    expect(await auditRows({ action: 'service.routine', entityId: v.id })).toHaveLength(0)
  })

  it('resets the service counter and date, keeps the requalification counter, and waits for a check run — signed and audited', async () => {
    const v = await vessel({ initialFiringsSinceService: 500, initialFiringsSinceRequalification: 3000, initialFiringsTotal: 7000, lastServicedAt: new Date(Date.now() - 100 * DAY).toISOString() })
    expect(v.state).toBe('overdue')
    const body = routine()
    const res = await record(v.id, body)
    expect(res.status).toBe(201)
    expect(res.body.vessel).toMatchObject({ firingsSinceService: 0, firingsSinceRequalification: 3000, firingsTotal: 7000, state: 'awaiting-verification', blocksSampleRuns: true, blocksAllFirings: false })
    expect(new Date(res.body.vessel.lastServicedAt).toISOString()).toBe(body.performedAt)
    expect(res.body.service.record.signature).toMatchObject({ signerName: 'Sam Adeyemi' })
    expect(res.body.service.signerName).toBe('Sam Adeyemi')
    expect(res.body.service.record.password).toBeUndefined()
    expect(res.body.effect.message).toMatch(/check run/)
    const [row] = await auditRows({ action: 'service.routine', entityId: v.id })
    expect(row.new_values.service.id).toBe(res.body.service.id)
    expect(row.old_values.firingsSinceService).toBe(500)
    expect(row.actor_name).toBe('Sam Adeyemi')
    // The service and its audit row share one transaction: the same instant.
    expect(new Date(row.at).getTime()).toBe(new Date(res.body.service.signedAt).getTime())
  })

  it('locks the vessel out when the leak test under water fails, without resetting its counters', async () => {
    const v = await vessel({ initialFiringsSinceService: 470, initialFiringsSinceRequalification: 900, initialFiringsTotal: 900 })
    const noWhere = await record(v.id, routine({ leakTest: { passed: false, pressureMPa: 3 } }))
    expect(noWhere.status).toBe(422)
    expect(noWhere.body.data.fields[0].path).toBe('leakTest.where')
    const res = await record(v.id, routine({ leakTest: { passed: false, pressureMPa: 3, where: 'outlet valve' } }))
    expect(res.status).toBe(201)
    expect(res.body.vessel).toMatchObject({ state: 'locked-out', condition: 'locked-out', firingsSinceService: 470, blocksAllFirings: true })
    expect(res.body.vessel.conditionReason).toMatch(/leak test under water failed \(bubbles at outlet valve\)/)
    expect(await serviceCount(v.id)).toBe(1)
  })

  it('locks the vessel out when the electrode resistance is above the policy limit of 5 Ω', async () => {
    const v = await vessel()
    const ok = await record(v.id, routine({ electrodeResistanceOhm: 5 }))
    expect(ok.body.vessel.state).toBe('awaiting-verification')
    const w = await vessel()
    const res = await record(w.id, routine({ electrodeResistanceOhm: 5.2 }))
    expect(res.status).toBe(201)
    expect(res.body.vessel.state).toBe('locked-out')
    expect(res.body.vessel.conditionReason).toMatch(/5\.20 Ω is above the limit of 5\.00 Ω/)
    expect(res.body.service.record.electrodeResistanceLimitOhm).toBe(5)
  })

  it('refuses a date in the future or before the last routine service (422), and checks the signature (403, audited)', async () => {
    const v = await vessel({ lastServicedAt: new Date(Date.now() - 10 * DAY).toISOString() })
    const future = await record(v.id, routine({ performedAt: new Date(Date.now() + DAY).toISOString() }))
    expect(future.status).toBe(422)
    expect(future.body.data.fields[0]).toMatchObject({ path: 'performedAt', message: 'must not be in the future' })
    const before = await record(v.id, routine({ performedAt: new Date(Date.now() - 20 * DAY).toISOString() }))
    expect(before.status).toBe(422)
    expect(before.body.data.fields[0].message).toMatch(/before the last routine service/)
    const wrong = await record(v.id, routine({ password: 'not-the-password' }))
    expect(wrong.status).toBe(403)
    expect(wrong.body.data.fields[0].path).toBe('password')
    expect(await auditRows({ action: 'signature.password-wrong', entityId: v.id })).toHaveLength(1)
    expect(await serviceCount(v.id)).toBe(0)
  })

  it('is the technician\'s: 401 without a session, 403 for other roles, 404 for an unknown vessel, 422 for an unknown kind', async () => {
    const v = await vessel()
    expect((await call('POST', `/api/vessels/${v.id}/services`, { body: routine() })).status).toBe(401)
    for (const role of ['analyst', 'supervisor', 'admin'] as const) expect((await record(v.id, routine(), role)).status).toBe(403)
    expect((await record('00000000-0000-4000-8000-000000000009', routine())).status).toBe(404)
    const bad = await record(v.id, { ...routine(), kind: 'polish' })
    expect(bad.status).toBe(422)
    expect(bad.body.data.fields[0].path).toBe('kind')
    expect(await serviceCount(v.id)).toBe(0)
  })
})

describe('requalification, lock-out and return to service', () => {
  it('a passing requalification resets both counters and both dates', async () => {
    const v = await vessel({ initialFiringsSinceService: 300, initialFiringsSinceRequalification: 5000, initialFiringsTotal: 8000, lastServicedAt: new Date(Date.now() - 50 * DAY).toISOString() })
    expect(v.state).toBe('requalification-due')
    const body = requalification()
    const res = await record(v.id, body)
    expect(res.status).toBe(201)
    expect(res.body.vessel).toMatchObject({ firingsSinceService: 0, firingsSinceRequalification: 0, firingsTotal: 8000, state: 'awaiting-verification' })
    expect(new Date(res.body.vessel.lastRequalifiedAt).toISOString()).toBe(body.performedAt)
    expect(new Date(res.body.vessel.lastServicedAt).toISOString()).toBe(body.performedAt)
  })

  it('a failed requalification locks the vessel out', async () => {
    const v = await vessel()
    const res = await record(v.id, requalification({ passed: false, certificateNumber: 'FAIL-1' }))
    expect(res.status).toBe(201)
    expect(res.body.vessel.state).toBe('locked-out')
    expect(res.body.vessel.conditionReason).toMatch(/failed \(certificate FAIL-1\)/)
  })

  it('damage at inspection locks out; the lock-out ends only after a passing requalification and a signed return to service', async () => {
    const v = await vessel({ initialFiringsSinceService: 100, initialFiringsSinceRequalification: 1000, initialFiringsTotal: 1000 })
    const clean = await record(v.id, { kind: 'inspection', performedAt: new Date().toISOString(), password: DEMO_PASSWORD, findings: 'Threads clean', damageOrCorrosionSeen: false })
    expect(clean.body.vessel.state).toBe('in-service')
    const insp = await record(v.id, { kind: 'inspection', performedAt: new Date().toISOString(), password: DEMO_PASSWORD, findings: 'Pitting on the head sealing face', damageOrCorrosionSeen: true })
    expect(insp.body.vessel.state).toBe('locked-out')

    const early = await record(v.id, { kind: 'return-to-service', performedAt: new Date().toISOString(), password: DEMO_PASSWORD, reason: 'Looks fine now' })
    expect(early.status).toBe(409)
    expect(early.body.message).toMatch(/passing requalification/)
    // A routine service never lifts a lock-out that needs requalification.
    const seals = await record(v.id, routine({ performedAt: new Date().toISOString() }))
    expect(seals.body.vessel).toMatchObject({ state: 'locked-out', firingsSinceService: 0 })
    expect((await record(v.id, { kind: 'return-to-service', performedAt: new Date().toISOString(), password: DEMO_PASSWORD, reason: 'Seals renewed' })).status).toBe(409)
    expect((await record(v.id, { kind: 'lock-out', performedAt: new Date().toISOString(), password: DEMO_PASSWORD, reason: 'again' })).status).toBe(409)

    const requal = await record(v.id, requalification({ performedAt: new Date().toISOString() }))
    expect(requal.body.vessel).toMatchObject({ state: 'locked-out', firingsSinceRequalification: 0 })
    const back = await record(v.id, { kind: 'return-to-service', performedAt: new Date().toISOString(), password: DEMO_PASSWORD, reason: 'Requalified; sealing face re-machined' })
    expect(back.status).toBe(201)
    expect(back.body.vessel).toMatchObject({ state: 'awaiting-verification', blocksSampleRuns: true })
    expect((await auditRows({ action: 'service.return-to-service', entityId: v.id }))).toHaveLength(1)
  })

  it('a lock-out from a failed leak test ends after a routine service that passes both checks — unless damage was found since', async () => {
    const v = await vessel()
    await record(v.id, routine({ leakTest: { passed: false, pressureMPa: 3, where: 'electrode' } }))
    const rts = { kind: 'return-to-service', password: DEMO_PASSWORD, reason: 'Electrode seal re-seated, leak test passed' }
    expect((await record(v.id, { ...rts, performedAt: new Date().toISOString() })).status).toBe(409)
    const again = await record(v.id, routine({ performedAt: new Date().toISOString() }))
    expect(again.body.vessel.state).toBe('locked-out')
    const back = await record(v.id, { ...rts, performedAt: new Date().toISOString() })
    expect(back.status).toBe(201)
    expect(back.body.vessel.state).toBe('awaiting-verification')

    // Escalation: damage seen while locked out for a leak replaces the cause, so a passing routine service no longer suffices.
    const w = await vessel()
    await record(w.id, routine({ leakTest: { passed: false, pressureMPa: 3, where: 'head' } }))
    await record(w.id, { kind: 'inspection', performedAt: new Date().toISOString(), password: DEMO_PASSWORD, findings: 'Corrosion in the head thread', damageOrCorrosionSeen: true })
    await record(w.id, routine({ performedAt: new Date().toISOString() }))
    const refused = await record(w.id, { ...rts, performedAt: new Date().toISOString() })
    expect(refused.status).toBe(409)
    expect(refused.body.message).toMatch(/requalification/)
  })

  it('a vessel sent away takes only its requalification, which brings it back awaiting a check run', async () => {
    const v = await vessel()
    const away = await record(v.id, { kind: 'sent-away', performedAt: new Date().toISOString(), password: DEMO_PASSWORD, destination: 'Test house' })
    expect(away.body.vessel).toMatchObject({ state: 'away', blocksAllFirings: true })
    const busy = await record(v.id, routine({ performedAt: new Date().toISOString() }))
    expect(busy.status).toBe(409)
    const back = await record(v.id, requalification({ performedAt: new Date().toISOString() }))
    expect(back.body.vessel.state).toBe('awaiting-verification')
  })

  it('adds nothing to a retired vessel (409)', async () => {
    const v = await vessel({ initialCondition: 'retired' })
    const res = await record(v.id, routine())
    expect(res.status).toBe(409)
    expect(await serviceCount(v.id)).toBe(0)
  })
})

describe('corrections and the history', () => {
  it('corrects a record by a new one pointing to it; the original stays, counters stay, and a record is corrected once', async () => {
    const v = await vessel({ initialFiringsSinceService: 200, initialFiringsSinceRequalification: 200, initialFiringsTotal: 200 })
    const first = (await record(v.id, routine({ packingNutTorqueNm: 21 }))).body
    const fix = await record(v.id, routine({ performedAt: first.service.performedAt, packingNutTorqueNm: 12, correctsId: first.service.id, notes: 'Torque mistyped' }))
    expect(fix.status).toBe(201)
    expect(fix.body.service.correctsId).toBe(first.service.id)
    expect(fix.body.effect.message).toMatch(/unchanged by a correction/)
    expect(fix.body.vessel.state).toBe('awaiting-verification')
    const list = (await call('GET', `/api/vessels/${v.id}/services`, { cookie: await as('analyst') })).body
    expect(list).toHaveLength(2)
    const original = list.find((s: any) => s.id === first.service.id)
    expect(original.record.packingNutTorqueNm).toBe(21)
    expect(original.correctedById).toBe(fix.body.service.id)
    expect(await auditRows({ action: 'service.correct', entityId: v.id })).toHaveLength(1)

    const twice = await record(v.id, routine({ correctsId: first.service.id }))
    expect(twice.status).toBe(409)
    const wrongKind = await record(v.id, { ...requalification(), correctsId: fix.body.service.id })
    expect(wrongKind.status).toBe(422)
    expect(wrongKind.body.data.fields[0].path).toBe('correctsId')
  })

  it('a correction showing a failed leak test locks the vessel out', async () => {
    const v = await vessel()
    const first = (await record(v.id, routine())).body
    const fix = await record(v.id, routine({ performedAt: first.service.performedAt, correctsId: first.service.id, leakTest: { passed: false, pressureMPa: 3, where: 'inlet valve' } }))
    expect(fix.status).toBe(201)
    expect(fix.body.vessel.state).toBe('locked-out')
  })

  it('lets every role read the history, newest first; 404 for an unknown vessel', async () => {
    const v = await vessel()
    await record(v.id, routine({ performedAt: new Date(Date.now() - 3 * HOUR).toISOString() }))
    await record(v.id, { kind: 'inspection', performedAt: new Date(Date.now() - HOUR).toISOString(), password: DEMO_PASSWORD, findings: 'All well', damageOrCorrosionSeen: false })
    for (const role of ['analyst', 'supervisor', 'technician', 'admin'] as const) {
      const res = await call('GET', `/api/vessels/${v.id}/services`, { cookie: await as(role) })
      expect(res.status).toBe(200)
      expect(res.body.map((s: any) => s.kind)).toEqual(['inspection', 'routine'])
    }
    expect((await call('GET', '/api/vessels/00000000-0000-4000-8000-000000000009/services', { cookie: await as('analyst') })).status).toBe(404)
  })
})

describe('the firing history of a vessel', () => {
  it('answers a page of firings with weekly counts for 26 weeks, and refuses a page size above 100', async () => {
    const v = await vessel({ initialFiringsTotal: 1200, initialFiringsSinceRequalification: 100, initialFiringsSinceService: 10 })
    const res = await call('GET', `/api/vessels/${v.id}/firings?pageSize=10`, { cookie: await as('analyst') })
    expect(res.status).toBe(200)
    expect(res.body).toMatchObject({ rows: [], page: 1, pageSize: 10, hasMore: false, recordedTotal: 0, firingsTotal: 1200 })
    expect(res.body.weekly).toHaveLength(26)
    // Weeks start on Monday (ISO 8601), as PostgreSQL's date_trunc('week').
    expect(new Date(`${res.body.weekly[0].weekStart}T00:00:00Z`).getUTCDay()).toBe(1)
    const bad = await call('GET', `/api/vessels/${v.id}/firings?pageSize=101`, { cookie: await as('analyst') })
    expect(bad.status).toBe(422)
    expect(bad.body.data.fields[0].path).toBe('pageSize')
  })
})

describe('a check run returns a serviced vessel to service', () => {
  // Benzoic acid 26,454 J/g weighed in air (NIST SRM 39j certificate); the check run agrees within the policy's
  // 0.3 % (common practice) when its charge and rise match the standardisation runs.
  const BA = 26454

  async function fire(runId: string, outcome = 'complete') {
    const res = await call('POST', `/api/runs/${runId}/firing`, { cookie: await as('analyst'), headers: { 'idempotency-key': unique('fire') }, body: { outcome, weighedMassG: 1.0 } })
    expect(res.status, JSON.stringify(res.body)).toBe(201)
    return res.body
  }

  it('after a routine service only standardisation or check runs fire; a passing check run ends the wait', async () => {
    const v = await vessel()
    const serviced = await record(v.id, routine())
    expect(serviced.body.vessel.state).toBe('awaiting-verification')
    const analyst = await as('analyst')
    const plan = (await call('POST', '/api/plans', { cookie: analyst, body: { name: unique('Verify'), vesselId: v.id, fillPressureMPa: 3.0 } })).body
    const ba = await benzoicAcidMaterialId()
    // Standardisation and check runs burn the library's reference standard; a sample run here is any sample at the same value.
    const charge = (kind: string) => ({ sampleCode: unique(kind.slice(0, 3).toUpperCase()), kind, components: [kind === 'sample' ? { role: 'sample', massG: 1.0, heatingValueJPerG: BA, smiles: 'OC(=O)c1ccccc1' } : { role: 'sample', massG: 1.0, materialId: ba }, { role: 'fuse', wire: 'platinum', lengthCm: 10 }] })
    const sample = await call('POST', `/api/plans/${plan.id}/runs`, { cookie: analyst, body: charge('sample') })
    expect(sample.body.assessment.verdict).toBe('blocked')
    await call('POST', `/api/runs/${sample.body.id}/withdraw`, { cookie: analyst, body: {} })
    const std = []
    for (let i = 0; i < 5; i++) std.push((await call('POST', `/api/plans/${plan.id}/runs`, { cookie: analyst, body: charge('standardisation') })).body)
    // Before an energy equivalent is accepted, a check run is refused up front: it could not be evaluated.
    const early = await call('POST', `/api/plans/${plan.id}/runs`, { cookie: analyst, body: charge('check') })
    expect(early.status).toBe(422)
    expect(early.body.data.fields[0]).toMatchObject({ path: 'kind', message: expect.stringMatching(/^standardise the vessel first: .* has no accepted energy equivalent/) })
    const submitted = await call('POST', `/api/plans/${plan.id}/submit`, { cookie: analyst, body: {} })
    expect(submitted.status, JSON.stringify(submitted.body)).toBe(200)
    expect(submitted.body.runs.every((r: any) => r.status === 'ready')).toBe(true)

    // Corrected rises around 2.6454 K give ε ≈ 10,000 J/K with a spread well inside the 0.20 % series limit (policy).
    const rises = [2.6454, 2.6460, 2.6448, 2.6456, 2.6452]
    const resultIds: string[] = []
    for (const [i, run] of std.entries()) {
      await fire(run.id)
      const res = await call('POST', `/api/runs/${run.id}/result`, { cookie: analyst, body: { temperatureRiseK: rises[i], sampleMassG: 1.0 } })
      expect(res.status, JSON.stringify(res.body)).toBe(201)
      resultIds.push(res.body.result.id)
    }
    const accepted = await call('POST', `/api/vessels/${v.id}/energy-equivalent`, { cookie: await as('supervisor'), body: { resultIds, password: DEMO_PASSWORD, reason: 'Series after the routine service' } })
    expect(accepted.status, JSON.stringify(accepted.body)).toBe(201)
    expect((await state(v.id)).state).toBe('awaiting-verification')

    const check = (await call('POST', `/api/plans/${plan.id}/runs`, { cookie: analyst, body: charge('check') })).body
    expect((await call('POST', `/api/plans/${plan.id}/submit`, { cookie: analyst, body: {} })).body.runs.find((r: any) => r.id === check.id).status).toBe('ready')
    await fire(check.id)
    const res = await call('POST', `/api/runs/${check.id}/result`, { cookie: analyst, body: { temperatureRiseK: 2.6454, sampleMassG: 1.0, certifiedValueJPerG: BA } })
    expect(res.status, JSON.stringify(res.body)).toBe(201)
    expect(res.body.check.returnedToService).toBe(true)
    const after = await state(v.id)
    expect(after).toMatchObject({ state: 'in-service', blocksSampleRuns: false })
  })
})
