import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { as, baseURL, call, unique } from '../support/api'
import { auditRows } from '../support/db'
import { newClient, receive } from '../support/samples'
import { BA_J_PER_G, FUSE_10CM_J, PASSWORD, benzoicAcidId, enterResult, fire, readyRuns, standardisedVessel } from '../unit/bench/bench-api'
import { pdfText } from '../unit/bench/pdf-text'

// Acid conventions, the repeatability floor of U, the lab's aid values and the certificate's refusals through the API.
// Sources: ISO 1928 (302 kJ/mol → 94.2 J per % S × g, from memory; r = 120 J/g), ISO 5725-6 (s_r = r/2.8),
// JCGM 100:2008 (u = s/√n; rectangular u = a/√3), the demo library's typical capsule range 17 500–19 500 J/g (from memory).
const FUSE = { wire: 'nichrome', burntLengthCm: 10 }
const EPS = 10_000
const thetaFor = (m: number, q: number, extraJ = 0) => (m * q + FUSE_10CM_J + extraJ) / EPS

let vesselId: string
let ba: string
let capsuleId: string
let policyBefore: Record<string, unknown>
beforeAll(async () => {
  const s = await standardisedVessel([10_000, 10_000, 10_000, 10_000, 10_000])
  vesselId = s.vessel.id
  ba = await benzoicAcidId()
  const mats = await call('GET', '/api/materials?q=Gelatin%20capsule&limit=50&derived=0', { cookie: await as('analyst') })
  capsuleId = mats.body.rows.find((m: { name: string }) => m.name === 'Gelatin capsule (combustion aid)').id
  policyBefore = (await call('GET', '/api/settings', { cookie: await as('admin') })).body.policy
})
afterAll(async () => {
  await call('PATCH', '/api/settings', { cookie: await as('admin'), body: { policy: { singleDeterminationCertificates: policyBefore.singleDeterminationCertificates }, reason: 'test restores the policy' } })
})

async function sample(code: string, body: Record<string, unknown>, spec: Record<string, unknown> = {}, m = 0.8) {
  const [run] = await readyRuns(vesselId, [{ sampleCode: code, materialId: ba, massG: m, ...spec }])
  expect((await fire(run!.id, { weighedMassG: m })).status).toBe(201)
  const res = await enterResult(run!.id, { fuse: FUSE, moistureAdPct: 0, ...body })
  expect(res.status, JSON.stringify(res.body)).toBe(201)
  return res.body.result
}

describe('acid corrections by what was measured', () => {
  it('a 3 % S coal with the nitric acid given as mol HNO3 is corrected by 94.2 J per (% S × g) (ISO 1928)', async () => {
    const m = 1.0
    const q = 28_000
    const sulfurJ = 94.2 * 3 * m // 282.6 J
    const nitricJ = 0.0008 * 59_700 // 47.76 J
    const r = await sample(unique('S3'), { temperatureRiseK: thetaFor(m, q, sulfurJ + nitricJ), sulfurPct: 3, acid: { nitricAcidMol: 0.0008 } }, {}, m)
    expect(r.values.corrections.acidConvention).toBe('nitric-acid')
    expect(r.values.corrections.sulfurJ).toBeCloseTo(sulfurJ, 9)
    expect(r.values.grossJPerG['air-dried']).toBeCloseTo(q, 6)
  })

  it('asks for the source of a chlorine figure and refuses chlorine with a total-acid titration (422 naming the field)', async () => {
    const [run] = await readyRuns(vesselId, [{ materialId: ba, massG: 0.8 }])
    await fire(run!.id, { weighedMassG: 0.8 })
    const noSource = await enterResult(run!.id, { temperatureRiseK: 2.2, chlorinePct: 0.5, acid: { nitricAcidMol: 0.001 } })
    expect(noSource.status).toBe(422)
    expect(noSource.body.data.fields.map((f: { path: string }) => f.path)).toContain('chlorineSource')
    const withTitration = await enterResult(run!.id, { temperatureRiseK: 2.2, chlorinePct: 0.5, chlorineSource: 'IC', acid: { titrantMl: 5, titrantJPerMl: 4.33 } })
    expect(withTitration.status).toBe(422)
    expect(withTitration.body.data.fields.map((f: { path: string }) => f.path)).toContain('chlorinePct')
  })
})

describe('uncertainty of a single determination', () => {
  it('never below 2·r/2.8 = 85.7 J/g (ISO 1928 r = 120 J/g; ISO 5725-6), with the budget on the result', async () => {
    const r = await sample(unique('U1'), { temperatureRiseK: thetaFor(0.8, BA_J_PER_G) })
    expect(r.values.uncertainty.expandedUncertaintyJPerG).toBeGreaterThanOrEqual(2 * 120 / 2.8)
    const names = r.values.uncertainty.contributions.map((c: { quantity: string }) => c.quantity)
    expect(names).toEqual(expect.arrayContaining(['energy equivalent', 'temperature rise', 'sample mass', 'certified value of the standard', 'repeatability (method r/2.8)']))
  })
})

describe('aid values: typical until the lab determines them', () => {
  it('a gelatin capsule at its typical value makes the result provisional; the lab\'s accepted series replaces it', async () => {
    const typical = await sample(unique('CAP'), { temperatureRiseK: thetaFor(0.8, BA_J_PER_G, 0.1 * 18_500) }, { aidMassG: 0.1, aidMaterialId: capsuleId })
    expect(typical.values.corrections.aidValueSource).toBe('typical')
    // Midpoint of 17 500–19 500 J/g with u = 2000/(2√3) = 577.4 J/g (rectangular, JCGM 100:2008 §4.3.7).
    expect(typical.values.corrections.aidHeatingValueJPerG).toBe(18_500)
    expect(typical.values.provisional.length).toBeGreaterThan(0)

    const supervisor = await as('supervisor')
    const tooFew = await call('POST', '/api/aid-values', { cookie: supervisor, body: { kind: 'capsule', materialId: capsuleId, determinationsJPerG: [18_010, 18_050], reason: 'lot 7', password: PASSWORD } })
    expect(tooFew.status).toBe(422)
    expect(tooFew.body.data.fields[0].path).toBe('determinationsJPerG')
    expect((await call('POST', '/api/aid-values', { cookie: await as('analyst'), body: {} })).status).toBe(403)
    const wrong = await call('POST', '/api/aid-values', { cookie: supervisor, body: { kind: 'capsule', materialId: capsuleId, determinationsJPerG: [18_010, 18_050, 18_030], reason: 'lot 7', password: 'nope' } })
    expect(wrong.status).toBe(403)
    const ok = await call('POST', '/api/aid-values', { cookie: supervisor, body: { kind: 'capsule', materialId: capsuleId, lot: '7', determinationsJPerG: [18_010, 18_050, 18_030], reason: 'lot 7 burnt alone', password: PASSWORD } })
    expect(ok.status, JSON.stringify(ok.body)).toBe(201)
    // mean 18 030 J/g, s = 20 J/g, u = 20/√3 = 11.5 J/g (JCGM 100:2008 §4.2.3)
    expect(ok.body.aidValue.meanJPerG).toBeCloseTo(18_030, 9)
    expect(ok.body.aidValue.standardUncertaintyJPerG).toBeCloseTo(20 / Math.sqrt(3), 9)
    const [row] = await auditRows({ action: 'aid-value.accept', entityId: ok.body.aidValue.id })
    expect(row.reason).toBe('lot 7 burnt alone')
    const list = await call('GET', '/api/aid-values', { cookie: await as('analyst') })
    expect(list.body.aidValues.find((a: { id: string }) => a.id === ok.body.aidValue.id)).toMatchObject({ active: true, materialName: 'Gelatin capsule (combustion aid)' })

    const determined = await sample(unique('CAP'), { temperatureRiseK: thetaFor(0.8, BA_J_PER_G, 0.1 * 18_030) }, { aidMassG: 0.1, aidMaterialId: capsuleId })
    expect(determined.values.corrections.aidValueSource).toBe('lab-determined')
    expect(determined.values.corrections.aidHeatingValueJPerG).toBeCloseTo(18_030, 9)
    expect(determined.values.provisional).toEqual([])
    expect(determined.values.grossJPerG['air-dried']).toBeCloseTo(BA_J_PER_G, 6)
  })
})

describe('certificates need agreeing duplicates unless the policy allows a single determination', () => {
  it('refuses a single determination (409), then says so prominently once the policy allows it; provisional values are flagged', async () => {
    // A received sample, so that the certificate has its client and receipt items.
    const code = (await receive((await newClient()).id)).labCode
    const r = await sample(code, { temperatureRiseK: thetaFor(0.8, BA_J_PER_G), aidHeatingValueJPerG: 46_000 }, { aidMassG: 0.05 })
    expect(r.values.provisional.length).toBe(1)
    const supervisor = await as('supervisor')
    expect((await call('POST', `/api/results/${r.id}/sign`, { cookie: supervisor, body: { password: PASSWORD, reason: 'checked' } })).status).toBe(200)
    const refused = await call('POST', '/api/reports', { cookie: supervisor, body: { sampleCode: code } })
    expect(refused.status).toBe(409)
    expect(refused.body.message).toMatch(/single determination/)
    expect(refused.body.message).not.toMatch(/before a value can be reported/)

    const admin = await as('admin')
    expect((await call('PATCH', '/api/settings', { cookie: admin, body: { policy: { singleDeterminationCertificates: true }, reason: 'single determinations for a client that asked for them' } })).status).toBe(200)
    const issued = await call('POST', '/api/reports', { cookie: supervisor, body: { sampleCode: code } })
    expect(issued.status, JSON.stringify(issued.body)).toBe(201)
    const text = pdfText(Buffer.from(await (await fetch(`${baseURL()}${issued.body.download}`, { headers: { cookie: supervisor } })).arrayBuffer()))
    expect(text).toContain('SINGLE DETERMINATION')
    expect(text).toContain('PROVISIONAL')
    // The certificate names the typical value it rests on: an aid value typed without its uncertainty counts as typical.
    expect(text).toMatch(/Aid heating value 46\s?000 J\/g is a typical value/)
    expect(text).toMatch(/Acid and sulfur corrections: Nitric acid determined on its own/)
    expect(text).toMatch(/reproducibility limit R = 300 J\/g/)
  })
})
