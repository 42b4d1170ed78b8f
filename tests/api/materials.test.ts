import { describe, expect, it } from 'vitest'
import { as, call, unique } from '../support/api'
import { auditRows } from '../support/db'

describe('materials library', () => {
  it('ships sourced reference data with derived figures', async () => {
    const res = await call('GET', '/api/materials?q=Benzoic%20acid,%20calorimetric', { cookie: await as('technician') })
    expect(res.status).toBe(200)
    const ba = res.body.rows[0]
    // NIST SRM 39j certificate: 26,454 J/g weighed in air.
    expect(ba.heatingValueJPerG).toBe(26454)
    expect(ba.heatingValueSource).toMatch(/SRM 39j/)
    // Stoichiometry: C7H6O2 + 7.5 O2, M = 122.12 g/mol → 0.06141 mol O2/g (IUPAC atomic weights).
    expect(ba.derived.oxygenDemandMolPerG).toBeCloseTo(0.06141, 4)
    // OB = −1600·(2·7 + 6/2 − 2)/122.12 = −196.5 % (definition, Meyer, Köhler & Homburg, Explosives).
    expect(ba.derived.oxygenBalancePct).toBeCloseTo(-196.5, 1)
    expect(ba.derived.screening.status).toBe('cleared')
  })

  it('flags the declared oxidiser and energetic entries', async () => {
    const an = (await call('GET', '/api/materials?q=Ammonium%20nitrate', { cookie: await as('analyst') })).body.rows[0]
    // Ammonium nitrate OB = +20.0 % (handbook value, Meyer, Köhler & Homburg).
    expect(an.derived.oxygenBalancePct).toBeCloseTo(20.0, 1)
    // Its structure holds a nitrate group and OB +20 % is not below −200 %: energetic by Table A6.1 (UN Appendix 6),
    // and it is an oxidiser judged on its share of a charge.
    expect(an.derived.screening.status).toBe('energetic')
    expect(an.derived.screening.oxidiser).toBeTruthy()
  })

  it('lets a supervisor add and edit materials (audited, reason required); others are refused', async () => {
    const sup = await as('supervisor')
    const body = { name: unique('Lignite lot'), category: 'coal', composition: { C: 65, H: 4.5, N: 1, S: 0.6, O: 20, ash: 8.9, moisture: 12 }, compositionBasis: 'dry' }
    expect((await call('POST', '/api/materials', { cookie: await as('analyst'), body })).status).toBe(403)
    const created = await call('POST', '/api/materials', { cookie: sup, body })
    expect(created.status).toBe(201)
    // Channiwala & Parikh 2002 (Fuel 81:1051): 0.3491·65 + 1.1783·4.5 + 0.1005·0.6 − 0.1034·20 − 0.0151·1 − 0.0211·8.9 = 25.783 MJ/kg dry;
    // as fired with 12 % moisture: 25.783 × 0.88 = 22.689 MJ/kg.
    expect(created.body.derived.estimatedHeatingValueJPerG).toBeCloseTo(22689, -1)
    expect(await auditRows({ action: 'material.create', entityId: created.body.id })).toHaveLength(1)
    // Derived figures are kept per process for a row as it is: read before the change, they must follow it after.
    const before = await call('GET', `/api/materials/${created.body.id}`, { cookie: sup })
    expect(before.body.derived.heatingValueSource).toBe('correlation')
    const noReason = await call('PATCH', `/api/materials/${created.body.id}`, { cookie: sup, body: { notes: 'x' } })
    expect(noReason.status).toBe(422)
    const ok = await call('PATCH', `/api/materials/${created.body.id}`, { cookie: sup, body: { heatingValueJPerG: 22400, heatingValueSource: 'lab result', reason: 'measured value now available' } })
    expect(ok.status).toBe(200)
    expect(ok.body.derived.heatingValueSource).toBe('material')
    const after = await call('GET', `/api/materials/${created.body.id}`, { cookie: sup })
    expect(after.body.derived).toMatchObject({ heatingValueSource: 'material', heatingValueJPerG: 22400 })
    const listed = await call('GET', `/api/materials?q=${encodeURIComponent(body.name)}`, { cookie: sup })
    expect(listed.body.rows[0].derived).toMatchObject({ heatingValueSource: 'material', heatingValueJPerG: 22400 })
    expect(await auditRows({ action: 'material.update', entityId: created.body.id })).toHaveLength(1)
  })

  it('names an unreadable formula, an unparseable structure and a composition over 100 %', async () => {
    const sup = await as('supervisor')
    const f = await call('POST', '/api/materials', { cookie: sup, body: { name: unique('m'), category: 'chemical', formula: 'C6H6Xx' } })
    expect(f.status).toBe(422)
    expect(f.body.data.fields[0].path).toBe('formula')
    const s = await call('POST', '/api/materials', { cookie: sup, body: { name: unique('m'), category: 'chemical', smiles: 'C1CC(' } })
    expect(s.status).toBe(422)
    expect(s.body.data.fields[0].path).toBe('smiles')
    const c = await call('POST', '/api/materials', { cookie: sup, body: { name: unique('m'), category: 'coal', composition: { C: 80, O: 30 } } })
    expect(c.status).toBe(422)
    expect(c.body.data.fields[0].path).toBe('composition')
  })
})
