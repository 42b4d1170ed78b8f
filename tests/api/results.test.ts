import Papa from 'papaparse'
import { ACID_CONVENTIONS } from '#shared/domain/results/acid'
import { beforeAll, describe, expect, it } from 'vitest'
import { as, baseURL, call, signIn, unique } from '../support/api'
import { auditRows } from '../support/db'
import { BA_J_PER_G, FUSE_10CM_J, PASSWORD, benzoicAcidId, enterResult, fire, readyRuns, registerVessel, standardisedVessel, vessel } from '../unit/bench/bench-api'
import { pdfText } from '../unit/bench/pdf-text'
import { newClient, receive } from '../support/samples'
import { synthesiseThermogram, thermogramCsv } from '../unit/bench/synthetic-thermogram'

// Results through the API. Check values and their sources:
//  • benzoic acid as an unknown must give back its certified 26 454 J/g (NIST SRM 39j certificate, weighed in air);
//  • q_v,gr = (ε·θ − Σe)/m (ASTM D5865; ISO 1928); ε = (m·q + e)/θ (ASTM D240 §8);
//  • net values: ISO 1928 / ISO 18125 formulas; H and O of C7H6O2 from IUPAC standard atomic weights;
//  • bases: ASTM D3180 / ISO 1170, checked against a published coal analysis (as tests/unit/results/bases.test.ts);
//  • duplicates: ISO 1928 r = 120 J/g (from memory, lab policy); critical range of three 1.2 r (ISO 5725-6 §5.2, from memory);
//  • uncertainty: JCGM 100:2008 eq. (10), u(ε) = s/√n (§4.2.3); u(θ) = 0.001 K, u(m) = 0.0001 g and 10 % of each correction are
//    the app's documented defaults (common practice).
const EPSILONS = [10_000, 10_005, 9_995, 10_002, 9_998]
const EPS_MEAN = EPSILONS.reduce((a, b) => a + b, 0) / EPSILONS.length // 10 000.0 J/K
const EPS_S = Math.sqrt(EPSILONS.reduce((a, e) => a + (e - EPS_MEAN) ** 2, 0) / (EPSILONS.length - 1)) // 3.808 J/K, JCGM 100:2008 eq. (4)
const M_H = 1.008
const M_C = 12.011
const M_O = 15.999
const BA_MOLAR = 7 * M_C + 6 * M_H + 2 * M_O
const H_PCT = (100 * 6 * M_H) / BA_MOLAR // 4.952 %
const O_PCT = (100 * 2 * M_O) / BA_MOLAR // 26.20 %
const FUSE = { wire: 'nichrome', burntLengthCm: 10 }
/** θ that a charge of m grams of q J/g (plus the 10 cm fuse) shows in a calorimeter of ε J/K: θ = (m·q + e_fuse)/ε. */
const thetaFor = (m: number, q: number, eps = EPS_MEAN) => (m * q + FUSE_10CM_J) / eps

let vesselId: string
let ba: string
beforeAll(async () => {
  const s = await standardisedVessel(EPSILONS)
  vesselId = s.vessel.id
  ba = await benzoicAcidId()
  expect(s.energyEquivalent.valueJPerK).toBeCloseTo(EPS_MEAN, 9)
})

async function sampleResult(code: string, q: number, extra: Record<string, unknown> = {}, m = 0.8) {
  const [run] = await readyRuns(vesselId, [{ sampleCode: code, materialId: ba, massG: m }])
  expect((await fire(run!.id, { weighedMassG: m })).status).toBe(201)
  const res = await enterResult(run!.id, { temperatureRiseK: thetaFor(m, q), fuse: FUSE, moistureAdPct: 0, ...extra })
  expect(res.status, JSON.stringify(res.body)).toBe(201)
  return { run: run!, result: res.body.result }
}

describe('benzoic acid as an unknown (NIST SRM 39j)', () => {
  it('gives back 26 454 J/g gross, dry and dry ash-free, with the net values of ISO 1928 and a GUM uncertainty', async () => {
    const m = 0.8
    const theta = thetaFor(m, BA_J_PER_G)
    const { result } = await sampleResult(unique('BA'), BA_J_PER_G, { ashDryPct: 0 }, m)
    const v = result.values
    expect(v.grossJPerG['air-dried']).toBeCloseTo(BA_J_PER_G, 6)
    expect(v.grossJPerG.dry).toBeCloseTo(BA_J_PER_G, 6)
    expect(v.grossJPerG['dry-ash-free']).toBeCloseTo(BA_J_PER_G, 6)
    // ISO 1928 / ISO 18125 with H and O of C7H6O2 (from the material's formula), N = 0, M = 0.
    expect(v.analysis.hydrogenDryPct).toBeCloseTo(H_PCT, 3)
    expect(v.netConstantVolumeJPerG.dry).toBeCloseTo(BA_J_PER_G - 206.0 * H_PCT, 1) // ≈ 25 434 J/g
    expect(v.netConstantPressureJPerG.dry).toBeCloseTo(BA_J_PER_G - 212.2 * H_PCT - 0.8 * O_PCT, 1) // ≈ 25 382 J/g
    // JCGM 100:2008 eq. (10): contributions c·u of ε, θ, m and the fuse (acid, sulfur and aid are 0 here).
    const uEps = EPS_S / Math.sqrt(5)
    // Also the certified value of the standard (NIST SRM 39j: ± 3 J/g taken as U with k = 2, from memory; c = (θ/m)·ε/26 434)
    // and the repeatability of one determination, s_r = r/2.8 = 42.86 J/g (ISO 1928 r = 120 J/g; ISO 5725-6).
    const parts = [(theta / m) * uEps, (EPS_MEAN / m) * 0.001, (BA_J_PER_G / m) * 0.0001, (0.1 * FUSE_10CM_J) / m, (theta / m) * (EPS_MEAN / 26_434) * 1.5, 120 / 2.8]
    const uc = Math.sqrt(parts.reduce((a, p) => a + p * p, 0)) // ≈ 46.6 J/g
    expect(v.energyEquivalent.standardUncertaintyJPerK).toBeCloseTo(uEps, 9)
    expect(v.uncertainty.combinedStandardUncertaintyJPerG).toBeCloseTo(uc, 6)
    expect(v.uncertainty.coverageFactor).toBe(2)
    expect(v.uncertainty.expandedUncertaintyJPerG).toBeCloseTo(2 * uc, 6)
  })

  it('works the corrected rise out of a thermogram synthesised with a known θ (Regnault–Pfaundler, ISO 1928)', async () => {
    const m = 0.8
    const theta = thetaFor(m, BA_J_PER_G) // 2.1259 K
    const [run] = await readyRuns(vesselId, [{ sampleCode: unique('BA-T'), materialId: ba, massG: m }])
    await fire(run!.id, { weighedMassG: m })
    const csv = thermogramCsv(synthesiseThermogram({ thetaK: theta }))
    const res = await enterResult(run!.id, { thermogram: { csv, fileName: 'firing.csv' }, fuse: FUSE, moistureAdPct: 0 })
    expect(res.status, JSON.stringify(res.body)).toBe(201)
    const v = res.body.result.values
    expect(v.temperatureRiseSource).toBe('regnault-pfaundler')
    // Regnault–Pfaundler recovers θ of this Newtonian model within 0.02 % (tests/unit/results/thermogram.test.ts).
    expect(Math.abs(v.temperatureRiseK - theta) / theta).toBeLessThan(2e-4)
    expect(Math.abs(v.grossJPerG['air-dried'] - BA_J_PER_G)).toBeLessThan(2e-4 * EPS_MEAN * theta / m)
    expect(v.thermogram).toMatchObject({ readings: 241, ignitionTimeS: 300, fileName: 'firing.csv' })
  })

  it('refuses a thermogram it cannot read, naming the line (422), and θ given twice', async () => {
    const [run] = await readyRuns(vesselId, [{ materialId: ba, massG: 0.8 }])
    await fire(run!.id, { weighedMassG: 0.8 })
    const bad = await enterResult(run!.id, { thermogram: { csv: 'time_s,temperature_c\n0,23.5\n5,abc\n' } })
    expect(bad.status).toBe(422)
    expect(bad.body.data.fields[0].path).toBe('thermogram.csv')
    expect(bad.body.message).toMatch(/line 3: Temperature "abc" is not a number/)
    const both = await enterResult(run!.id, { temperatureRiseK: 2, thermogram: { csv: 'time_s,temperature_c\n' } })
    expect(both.status).toBe(422)
    expect(both.body.data.fields[0].path).toBe('temperatureRiseK')
  })
})

describe('bases against a published coal analysis (ASTM D3180; ISO 1170)', () => {
  it('dry 14 078 Btu/lb with 7.28 % total moisture gives 13 053 Btu/lb as received', async () => {
    // The report's dry gross value (1 Btu/lb = 2.326 J/g, NIST SP 811), fired as a declared sample with M_ad = 0.
    const qDry = 14_078 * 2.326
    // A coal the supervisor classified in the library, with its declared value and no elemental analysis.
    const coal = await call('POST', '/api/materials', { cookie: await as('supervisor'), body: { name: unique('Report coal'), category: 'coal', heatingValueJPerG: qDry } })
    expect(coal.status, JSON.stringify(coal.body)).toBe(201)
    const [run] = await readyRuns(vesselId, [{ sampleCode: unique('COAL'), massG: 0.8, materialId: coal.body.id }])
    await fire(run!.id, { weighedMassG: 0.8 })
    const res = await enterResult(run!.id, { temperatureRiseK: thetaFor(0.8, qDry), fuse: FUSE, moistureAdPct: 0, moistureArPct: 7.28, ashDryPct: 9.47 })
    expect(res.status).toBe(201)
    const g = res.body.result.values.grossJPerG
    expect(g.dry / 2.326).toBeCloseTo(14_078, 6)
    expect(g['as-received'] / 2.326).toBeCloseTo(13_053, 0) // the report's as-received column
    expect(g['dry-ash-free']).toBeCloseTo((qDry * 100) / (100 - 9.47), 6) // daf = dry·100/(100 − A_d)
    // Without hydrogen no net value is computed, and the page is told why.
    expect(res.body.result.values.netConstantVolumeJPerG).toEqual({})
    expect(res.body.result.values.missing.join(' ')).toMatch(/Hydrogen not given/)
  })
})

describe('duplicates (ISO 1928 repeatability r = 120 J/g, lab policy)', () => {
  it('reports the mean of two results within r and never averages two results outside it', async () => {
    const inLimit = unique('DUP-IN')
    await sampleResult(inLimit, BA_J_PER_G)
    await sampleResult(inLimit, BA_J_PER_G + 100)
    const out = unique('DUP-OUT')
    await sampleResult(out, BA_J_PER_G)
    await sampleResult(out, BA_J_PER_G + 150)
    const list = await call('GET', `/api/results?kind=sample`, { cookie: await as('analyst') })
    const a = list.body.duplicates[inLimit]
    expect(a.status).toBe('accepted')
    expect(a.value).toBeCloseTo(BA_J_PER_G + 50, 6)
    expect(a.reported.grossJPerG['air-dried']).toBeCloseTo(BA_J_PER_G + 50, 6)
    const b = list.body.duplicates[out]
    expect(b.status).toBe('third-determination-needed')
    expect(b.value).toBeNull()
    expect(b.reported.grossJPerG).toEqual({})
    expect(b.message).toMatch(/make a third determination/)
    // A third result: range 150 J/g > 1.2 r = 144 J/g, so the median is reported and flagged (ISO 5725-6 §5.2).
    await sampleResult(out, BA_J_PER_G + 66)
    const c = (await call('GET', `/api/results?sampleCode=${out}`, { cookie: await as('analyst') })).body.duplicates[out]
    expect(c.status).toBe('median-flagged')
    expect(c.value).toBeCloseTo(BA_J_PER_G + 66, 6)
  })
})

describe('sign-off, revisions and the certificate', () => {
  it('follows the rules: supervisor only, re-authenticated, once; a change is a new audited revision; only signed results are certified', async () => {
    // A certificate names the client and the item as received: the sample is received first and keeps its lab code.
    const code = (await receive((await newClient()).id)).labCode
    const first = await sampleResult(code, BA_J_PER_G)
    const second = await sampleResult(code, BA_J_PER_G + 80)
    const supervisor = await as('supervisor')

    expect((await call('POST', `/api/results/${first.result.id}/sign`, { cookie: await as('analyst'), body: { password: PASSWORD, reason: 'ok' } })).status).toBe(403)
    const wrong = await call('POST', `/api/results/${first.result.id}/sign`, { cookie: supervisor, body: { password: 'not-my-password', reason: 'checked' } })
    expect(wrong.status).toBe(403)
    expect(await auditRows({ action: 'signature.password-wrong', entityId: first.result.id })).toHaveLength(1)
    const notSigned = await call('POST', '/api/reports', { cookie: supervisor, body: { sampleCode: code } })
    expect(notSigned.status).toBe(409)
    expect(notSigned.body.message).toMatch(/Only signed results can be certified/)

    const signed = await call('POST', `/api/results/${first.result.id}/sign`, { cookie: supervisor, body: { password: PASSWORD, reason: 'corrections checked' } })
    expect(signed.status).toBe(200)
    expect(signed.body).toMatchObject({ status: 'signed', signature: { signerName: 'Helena Ruiz', valid: true } })
    expect((await call('POST', `/api/results/${first.result.id}/sign`, { cookie: supervisor, body: { password: PASSWORD, reason: 'again' } })).status).toBe(409)

    // A change after sign-off: a new revision with a reason; the signed one stays, no longer current.
    const noReason = await call('POST', `/api/results/${second.result.id}/revise`, { cookie: await as('analyst'), body: { temperatureRiseK: thetaFor(0.8, BA_J_PER_G + 40), fuse: FUSE, moistureAdPct: 0 } })
    expect(noReason.status).toBe(422)
    expect(noReason.body.data.fields[0].path).toBe('reason')
    const revised = await call('POST', `/api/results/${second.result.id}/revise`, { cookie: await as('analyst'), body: { temperatureRiseK: thetaFor(0.8, BA_J_PER_G + 40), fuse: FUSE, moistureAdPct: 0, reason: 'θ read from the wrong firing' } })
    expect(revised.status).toBe(201)
    expect(revised.body.result).toMatchObject({ revision: 2, current: true, status: 'unsigned', supersedesId: second.result.id, reason: 'θ read from the wrong firing' })
    expect(revised.body.result.values.grossJPerG['air-dried']).toBeCloseTo(BA_J_PER_G + 40, 6)
    const old = await call('GET', `/api/results/${second.result.id}`, { cookie: await as('analyst') })
    expect(old.body.result.current).toBe(false)
    expect(old.body.revisions.map((r: { revision: number }) => r.revision)).toEqual([1, 2])
    const [audit] = await auditRows({ action: 'result.revise', entityId: revised.body.result.id })
    expect(audit.reason).toBe('θ read from the wrong firing')
    expect(audit.old_values).toMatchObject({ revision: 1 })
    expect((await call('POST', `/api/results/${second.result.id}/revise`, { cookie: await as('analyst'), body: { temperatureRiseK: 2, reason: 'again' } })).status).toBe(409)
    expect((await enterResult(second.run.id, { temperatureRiseK: 2 })).status).toBe(409)

    expect((await call('POST', `/api/results/${revised.body.result.id}/sign`, { cookie: supervisor, body: { password: PASSWORD, reason: 'revision checked' } })).status).toBe(200)
    const report = await call('POST', '/api/reports', { cookie: supervisor, body: { sampleCode: code } })
    expect(report.status).toBe(201)
    expect(report.body.reportNumber).toBeGreaterThanOrEqual(1001)
    const again = await call('POST', '/api/reports', { cookie: supervisor, body: { sampleCode: code } })
    expect(again.body.reportNumber).toBe(report.body.reportNumber + 1)

    const pdf = await fetch(`${baseURL()}${report.body.download}`, { headers: { cookie: await as('analyst') } })
    expect(pdf.status).toBe(200)
    expect(pdf.headers.get('content-type')).toBe('application/pdf')
    expect(pdf.headers.get('content-disposition')).toBe(`attachment; filename="certificate-${report.body.reportNumber}-${code}.pdf"`)
    const text = pdfText(Buffer.from(await pdf.arrayBuffer()))
    expect(text).toContain('Kestrel Ridge Fuels Laboratory')
    expect(text).toContain(`Report No. ${report.body.reportNumber}`)
    expect(text).toContain(code)
    expect(text).toContain('Gross calorific value at constant volume')
    // Mean of 26 454 and 26 494 J/g (ISO 1928 r: 40 J/g apart, within 120 J/g).
    expect(text).toContain('26,474')
    expect(text).toMatch(/The two results differ by 40 J\/g, within 120 J\/g \(r\); the mean is reported\./)
    expect(text).toContain('Helena Ruiz')
    expect(text).toContain('End of report')
    // Every page says which of how many it is, the last one included.
    const pages = [...text.matchAll(/Page (\d+) of (\d+)/g)].map(m => [Number(m[1]), Number(m[2])])
    expect(pages.length).toBeGreaterThan(0)
    expect(pages.at(-1)![0]).toBe(pages.at(-1)![1])
    const reissue = pdfText(Buffer.from(await (await fetch(`${baseURL()}${again.body.download}`, { headers: { cookie: supervisor } })).arrayBuffer()))
    expect(reissue).toContain(`This report replaces report No. ${report.body.reportNumber}.`)
  })

  it('refuses a certificate while the duplicates disagree, and a sign-off by the person who fired the run', async () => {
    const code = unique('DISAGREE')
    const a = await sampleResult(code, BA_J_PER_G)
    const b = await sampleResult(code, BA_J_PER_G + 200)
    const supervisor = await as('supervisor')
    for (const r of [a, b]) {
      const signed = await call('POST', `/api/results/${r.result.id}/sign`, { cookie: supervisor, body: { password: PASSWORD, reason: 'checked' } })
      expect(signed.status, JSON.stringify(signed.body)).toBe(200)
    }
    const refused = await call('POST', '/api/reports', { cookie: supervisor, body: { sampleCode: code } })
    expect(refused.status).toBe(409)
    expect(refused.body.message).toMatch(/third determination/)

    // One person with both roles fires and enters a result: they may not sign it off (separation of duties).
    const email = `${unique('both')}@emberline.test`
    const created = await call('POST', '/api/admin/users', { cookie: await as('admin'), body: { email, name: 'Ada Both', roles: ['analyst', 'supervisor'], password: 'both-roles-2026!' } })
    expect(created.status).toBe(201)
    const both = await signIn(email, 'both-roles-2026!')
    const [run] = await readyRuns(vesselId, [{ materialId: ba, massG: 0.8 }], both)
    await fire(run!.id, { weighedMassG: 0.8 }, { cookie: both })
    const own = await enterResult(run!.id, { temperatureRiseK: thetaFor(0.8, BA_J_PER_G), fuse: FUSE }, both)
    const res = await call('POST', `/api/results/${own.body.result.id}/sign`, { cookie: both, body: { password: 'both-roles-2026!', reason: 'mine' } })
    expect(res.status).toBe(403)
    expect(res.body.message).toMatch(/separation of duties/)
  })

  it('exports the results as CSV with their figures', async () => {
    const res = await call('GET', '/api/results/export.csv?kind=sample', { cookie: await as('analyst') })
    expect(res.status).toBe(200)
    expect(res.headers.get('content-disposition')).toMatch(/^attachment; filename="emberline-results-\d{8}\.csv"$/)
    const { data: [header, ...rows] } = Papa.parse<string[]>(String(res.body).replace(/^\uFEFF/, '').trim())
    // Units in the headers; the acid convention, the expanded uncertainty on each basis and the provisional flag.
    expect(header).toEqual(expect.arrayContaining(['sample_mass (g)', 'gross_ad (J/g)', 'acid_convention', 'U_k2_gross_dry (J/g)', 'U_k2_net_p_ar (J/g)', 'provisional', 'provisional_because']))
    expect(rows.length).toBeGreaterThan(5)
    const col = (name: string) => header!.indexOf(name)
    for (const row of rows) {
      expect(row).toHaveLength(header!.length)
      expect(ACID_CONVENTIONS).toContain(row[col('acid_convention')])
      expect(['true', 'false']).toContain(row[col('provisional')])
    }
  })
})

describe('refusals of a result', () => {
  it('409 before a firing, after a misfire, and on a vessel with no accepted energy equivalent ("standardise the vessel first")', async () => {
    const [notFired, misfired] = await readyRuns(vesselId, [{}, {}])
    expect((await enterResult(notFired!.id, { temperatureRiseK: 2 })).status).toBe(409)
    await fire(misfired!.id, { outcome: 'misfire' })
    const mis = await enterResult(misfired!.id, { temperatureRiseK: 2 })
    expect(mis.status).toBe(409)
    expect(mis.body.message).toMatch(/misfire/)
    const bare = await registerVessel()
    const [run] = await readyRuns(bare.id, [{}])
    await fire(run!.id)
    const res = await enterResult(run!.id, { temperatureRiseK: 2.6 })
    expect(res.status).toBe(409)
    expect(res.body.message).toMatch(/standardise the vessel first/)
    expect((await enterResult(run!.id, { temperatureRiseK: 2.6 }, await as('supervisor'))).status).toBe(403)
  })
})

describe('a check run after service', () => {
  it('keeps the vessel waiting when it disagrees, and returns it to service in the same step when it agrees', async () => {
    // Standardisation runs are allowed while a vessel awaits verification.
    const s = await standardisedVessel(EPSILONS, { initialCondition: 'awaiting-verification' })
    expect((await vessel(s.vessel.id)).state).toBe('awaiting-verification')
    const [bad, good] = await readyRuns(s.vessel.id, [{ kind: 'check', materialId: ba, massG: 1 }, { kind: 'check', materialId: ba, massG: 1 }])
    await fire(bad!.id)
    // 1 % high against the certified 26 454 J/g: outside the 0.3 % check tolerance (lab policy, common practice).
    const off = await enterResult(bad!.id, { temperatureRiseK: thetaFor(1, BA_J_PER_G * 1.01), fuse: FUSE })
    expect(off.status).toBe(201)
    expect(off.body.result.values.check).toMatchObject({ certifiedJPerG: BA_J_PER_G, passed: false })
    expect(off.body.result.values.check.deviationPct).toBeCloseTo(1, 6)
    expect(off.body.check).toMatchObject({ returnedToService: false })
    expect(off.body.check.message).toMatch(/stays awaiting verification/)
    expect((await vessel(s.vessel.id)).state).toBe('awaiting-verification')

    await fire(good!.id)
    const ok = await enterResult(good!.id, { temperatureRiseK: thetaFor(1, BA_J_PER_G), fuse: FUSE })
    expect(ok.body.result.values.check.passed).toBe(true)
    expect(ok.body.check.returnedToService).toBe(true)
    const after = await vessel(s.vessel.id)
    expect(after.state).toBe('in-service')
    expect(after.condition).toBe('normal')
    const [row] = await auditRows({ action: 'vessel.return-to-service', entityId: s.vessel.id })
    expect(row.new_values.checkResultId).toBe(ok.body.result.id)
  })
})
