import { beforeAll, describe, expect, it } from 'vitest'
import { assess, type ChargeInput } from '#shared/domain/assessment'
import type { LabPolicy } from '#shared/domain/policy'
import { as, call } from '../support/api'

// A typical standard vessel: ≈ 33 kJ rating, 40 atm ≈ 4.05 MPa maximum fill, 300 mL (secondary
// summaries of ASTM E144); the 1.5 g maximum charge is the demo lab's (data/demo-lab.ts), a fixture, not a check value.
const VESSEL = { ratedEnergyJ: 33000, maxChargeMassG: 1.5, maxFillPressureMPa: 4.05, volumeMl: 300, class: 'standard' }
// Benzoic acid weighed in air, 26,454 J/g (NIST SRM 39j certificate); nickel-chromium fuse 9.6 J/cm (from memory).
const BA_J_PER_G = 26454
const NICHROME_J_PER_CM = 9.6
const benzoicAcid = (massG: number, extra: Record<string, unknown> = {}) => ({ role: 'sample', massG, heatingValueJPerG: BA_J_PER_G, smiles: 'OC(=O)c1ccccc1', ...extra })
const fuse = { role: 'fuse', wire: 'nichrome', lengthCm: 10 }
const charge = (over: Record<string, unknown> = {}) => ({ vessel: VESSEL, fillPressureMPa: 3.0, components: [benzoicAcid(1.0), fuse], ...over })

async function post(body: unknown) {
  return call('POST', '/api/assess', { cookie: await as('analyst'), body })
}
const paths = (res: { body: { data?: { fields?: { path: string }[] } } }) => (res.body.data?.fields ?? []).map(f => f.path)

interface VesselRow { id: string, name: string, state: string }
let vessels: VesselRow[] = []
let policy: LabPolicy
beforeAll(async () => {
  const cookie = await as('analyst')
  vessels = (await call<VesselRow[]>('GET', '/api/vessels', { cookie })).body
  policy = (await call<{ policy: LabPolicy }>('GET', '/api/settings', { cookie })).body.policy
})
const vesselNamed = (name: string) => {
  const v = vessels.find(x => x.name === name)
  if (!v) throw new Error(`demo vessel ${name} is missing (data/demo-lab.ts)`)
  return v
}

describe('POST /api/assess — the public contract', () => {
  it('answers the §6 fields for 1.0 g benzoic acid with a 10 cm nickel-chromium fuse at 3.0 MPa gauge', async () => {
    const res = await post(charge({ components: [benzoicAcid(1.0, { formula: 'C7H6O2', smiles: 'OC(=O)c1ccccc1' }), fuse] }))
    expect(res.status).toBe(200)
    for (const key of ['verdict', 'heatReleaseJ', 'oxygenDemandMol', 'oxygenAvailableMol', 'oxygenExcess', 'peakPressureBoundMPa', 'components', 'findings']) {
      expect(res.body).toHaveProperty(key)
    }
    expect(res.body.verdict).toBe('clear')
    // Q = 1.0 g × 26,454 J/g (NIST SRM 39j certificate) + 10 cm × 9.6 J/cm (from memory) = 26,550 J.
    expect(res.body.heatReleaseJ).toBeCloseTo(1.0 * BA_J_PER_G + 10 * NICHROME_J_PER_CM, 6)
    const [sample, wire] = res.body.components
    expect(sample).toMatchObject({ heatingValueJPerG: BA_J_PER_G, heatingValueSource: 'declared' })
    expect(wire).toMatchObject({ heatingValueJPerG: null, heatingValueSource: 'fuse-wire' })
    // C7H6O2 + 7.5 O2 → 7 CO2 + 3 H2O: 7.5 / 122.12 g/mol = 0.06141 mol/g (stoichiometry, IUPAC atomic weights).
    expect(sample.oxygenDemandMol).toBeCloseTo(0.06141, 4)
    // OB% = −1600·(2·7 + 6/2 − 2)/122.12 = −196.5 % (definition in Meyer, Köhler & Homburg, Explosives).
    expect(sample.oxygenBalancePct).toBeCloseTo((-1600 * (2 * 7 + 6 / 2 - 2)) / 122.12, 0)
    // Excess is available ÷ demand by definition.
    expect(res.body.oxygenExcess).toBeCloseTo(res.body.oxygenAvailableMol / res.body.oxygenDemandMol, 9)
    // 1 g benzoic acid in 300 mL at 3.10 MPa abs: bound ≈ 26.5 MPa (computed from the NASA polynomials, McBride, Zehe &
    // Gordon 2002); the 1 mL of water, the charge volume and the fuse move it by well under 3 %.
    expect(Math.abs(res.body.peakPressureBoundMPa - 26.5) / 26.5).toBeLessThan(0.03)
    for (const f of res.body.findings) expect(Object.keys(f)).toEqual(expect.arrayContaining(['code', 'severity', 'message']))
  })

  it('gives the same answer as the shared code the Quick check page runs in the browser', async () => {
    const body = charge()
    const res = await post(body)
    expect(res.status).toBe(200)
    const local = await assess(body as ChargeInput, policy)
    expect(JSON.parse(JSON.stringify(local))).toEqual(res.body)
  })

  it('blocks 1.5 g of benzoic acid above the 33 kJ rating and says what mass would pass', async () => {
    const res = await post(charge({ components: [benzoicAcid(1.5), fuse] }))
    expect(res.status).toBe(200)
    expect(res.body.verdict).toBe('blocked')
    const over = res.body.findings.find((f: { code: string }) => f.code === 'energy-over-rating')
    // (33,000 J − 96 J) / 26,454 J/g = 1.2438 g → "≤ 1.24 g" (NIST SRM 39j value; fuse 9.6 J/cm from memory).
    expect(over).toMatchObject({ severity: 'block' })
    expect(over.message).toContain('reduce the sample to ≤ 1.24 g')
  })

  it('assesses a sample without a mass at the suggested mass and says so', async () => {
    const res = await post(charge({ components: [{ role: 'sample', heatingValueJPerG: BA_J_PER_G, smiles: 'OC(=O)c1ccccc1' }, fuse] }))
    expect(res.status).toBe(200)
    expect(res.body.findings.map((f: { code: string }) => f.code)).toContain('suggested-mass')
    // Target 26 kJ (policy default, common practice): (26,000 − 96) J / 26,454 J/g = 0.979 g, rounded down to 0.97 g.
    expect(res.body.suggestions.targetSampleMassG).toBeCloseTo(0.97, 2)
  })

  it('screens TNT: a formula alone needs approval, its structure blocks it in a standard vessel', async () => {
    const byFormula = await post(charge({ components: [{ role: 'sample', massG: 0.5, formula: 'C7H5N3O6' }, fuse] }))
    expect(byFormula.status).toBe(200)
    expect(byFormula.body.findings.map((f: { code: string }) => f.code)).toContain('structure-needed')
    // TNT oxygen balance −74.0 % (Meyer, Köhler & Homburg, Explosives).
    expect(byFormula.body.components[0].oxygenBalancePct).toBeCloseTo(-74.0, 0)
    const byStructure = await post(charge({ components: [{ role: 'sample', massG: 0.5, smiles: 'Cc1c(cc(cc1[N+](=O)[O-])[N+](=O)[O-])[N+](=O)[O-]' }, fuse] }))
    expect(byStructure.status).toBe(200)
    expect(byStructure.body.verdict).toBe('blocked')
    expect(byStructure.body.findings.map((f: { code: string }) => f.code)).toContain('energetic-in-standard-vessel')
  })
})

describe('POST /api/assess — vessel from the register', () => {
  it('uses the record and its current state: a locked-out vessel blocks (vessel-locked-out)', async () => {
    const elder = vesselNamed('KR-5 Elder')
    expect(elder.state).toBe('locked-out')
    const { vessel: _inline, ...rest } = charge()
    const res = await post({ ...rest, vesselId: elder.id })
    expect(res.status).toBe(200)
    expect(res.body.verdict).toBe('blocked')
    expect(res.body.findings).toEqual(expect.arrayContaining([expect.objectContaining({ code: 'vessel-locked-out', severity: 'block' })]))
  })

  it('lets the record win over an inline vessel, so a state cannot be bypassed', async () => {
    const res = await post(charge({ vesselId: vesselNamed('KR-5 Elder').id, vessel: { ...VESSEL, state: 'in-service' } }))
    expect(res.status).toBe(200)
    expect(res.body.findings.map((f: { code: string }) => f.code)).toContain('vessel-locked-out')
  })

  it('clears the same charge in a vessel in service', async () => {
    const { vessel: _inline, ...rest } = charge()
    const res = await post({ ...rest, vesselId: vesselNamed('KR-1 Aster').id })
    expect(res.status).toBe(200)
    expect(res.body.verdict).toBe('clear')
  })

  it('answers 404 for an unknown vessel and 422 for an id that is not one', async () => {
    const { vessel: _inline, ...rest } = charge()
    expect((await post({ ...rest, vesselId: '00000000-0000-4000-8000-000000000000' })).status).toBe(404)
    const bad = await post({ ...rest, vesselId: 'KR-1' })
    expect(bad.status).toBe(422)
    expect(paths(bad)).toContain('vesselId')
  })
})

describe('POST /api/assess — refusals', () => {
  it('answers 401 without a session, before looking at the body', async () => {
    const res = await call('POST', '/api/assess', { body: { nonsense: true } })
    expect(res.status).toBe(401)
  })

  it.each([
    ['a negative mass', charge({ components: [benzoicAcid(-1), fuse] }), ['components.0.massG']],
    ['an aid without its mass', charge({ components: [benzoicAcid(1), { role: 'aid', heatingValueJPerG: BA_J_PER_G }, fuse] }), ['components.1.massG']],
    ['a wire fuse without its length', charge({ components: [benzoicAcid(1), { role: 'fuse', wire: 'nichrome' }] }), ['components.1.lengthCm']],
    ['a cotton thread without its mass', charge({ components: [benzoicAcid(1), { role: 'fuse', wire: 'cotton' }] }), ['components.1.massG']],
    ['numbers sent as text', charge({ fillPressureMPa: '3.0', components: [benzoicAcid(1, { massG: '1.0' }), fuse] }), ['fillPressureMPa', 'components.0.massG']],
    ['a vessel rating that is not a number', charge({ vessel: { ...VESSEL, ratedEnergyJ: 'lots' } }), ['vessel.ratedEnergyJ']],
    ['an unknown element in a formula', charge({ components: [{ role: 'sample', massG: 1, formula: 'C6H6Xx' }, fuse] }), ['components.0.formula']],
    ['an unparseable SMILES', charge({ components: [{ role: 'sample', massG: 1, smiles: 'C1CC(' }, fuse] }), ['components.0.smiles']],
    ['a composition over 100 %', charge({ components: [{ role: 'sample', massG: 1, composition: { C: 80, H: 15, O: 10, basis: 'dry' } }, fuse] }), ['components.0.composition']],
    ['an empty component list', charge({ components: [] }), ['components']],
    ['no vessel at all', { fillPressureMPa: 3, components: [benzoicAcid(1), fuse] }, ['vesselId']],
    ['an array instead of an object', [charge()], ['(body)']],
  ])('refuses %s with 422 naming the field', async (_what, body, expected) => {
    const res = await post(body)
    expect(res.status).toBe(422)
    expect(res.body.statusCode).toBe(422)
    expect(paths(res)).toEqual(expect.arrayContaining(expected))
  })

  it('names every failing formula and structure at once', async () => {
    const res = await post(charge({ components: [{ role: 'sample', massG: 0.5, formula: 'C6H6Xx' }, { role: 'sample', massG: 0.5, smiles: 'c1ccc(' }, fuse] }))
    expect(res.status).toBe(422)
    expect(paths(res)).toEqual(expect.arrayContaining(['components.0.formula', 'components.1.smiles']))
  })

  it('refuses a number too large for JSON arithmetic (1e999 → Infinity) with 422', async () => {
    const raw = JSON.stringify(charge()).replace('"fillPressureMPa":3', '"fillPressureMPa":1e999')
    const res = await call('POST', '/api/assess', { cookie: await as('analyst'), raw, headers: { 'content-type': 'application/json' } })
    expect(res.status).toBe(422)
    expect(paths(res)).toContain('fillPressureMPa')
  })

  it('answers 400 for a body that is not JSON and 415 for one not sent as JSON', async () => {
    const cookie = await as('analyst')
    const broken = await call('POST', '/api/assess', { cookie, raw: '{"vessel": {', headers: { 'content-type': 'application/json' } })
    expect(broken.status).toBe(400)
    expect(broken.body.statusCode).toBe(400)
    const text = await call('POST', '/api/assess', { cookie, raw: 'fillPressureMPa=3', headers: { 'content-type': 'text/plain' } })
    expect(text.status).toBe(415)
  })

  it('is open to every signed-in role', async () => {
    for (const role of ['analyst', 'supervisor', 'technician', 'admin'] as const) {
      expect((await call('POST', '/api/assess', { cookie: await as(role), body: charge() })).status).toBe(200)
    }
  })
})
