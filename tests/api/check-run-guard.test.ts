import { describe, expect, it } from 'vitest'
import { as, call, unique } from '../support/api'
import { auditRows } from '../support/db'
import { BA_J_PER_G, benzoicAcidId, registerVessel, standardisedVessel } from '../unit/bench/bench-api'

// A check run is compared with the vessel's accepted energy equivalent: without one it is refused when it is
// planned, before anything is signed or fired. Charge: 1 g benzoic acid, 26 454 J/g weighed in air (NIST SRM 39j).
// Standardisation and check runs burn the library's reference standard.
const charge = async (kind: string) => ({ sampleCode: unique(kind.slice(0, 3).toUpperCase()), kind, components: [{ role: 'sample', massG: 1, materialId: await benzoicAcidId() }, { role: 'fuse', wire: 'nichrome', lengthCm: 10 }] })

async function planOn(vesselId: string) {
  const plan = await call('POST', '/api/plans', { cookie: await as('analyst'), body: { name: unique('plan'), vesselId, fillPressureMPa: 3.0 } })
  expect(plan.status).toBe(201)
  return plan.body.id as string
}

describe('check run refused up front', () => {
  it('refuses a check run on a vessel with no accepted energy equivalent, naming the field, and stores nothing', async () => {
    const v = await registerVessel({ initialCondition: 'awaiting-verification' })
    const planId = await planOn(v.id)
    const analyst = await as('analyst')
    const res = await call('POST', `/api/plans/${planId}/runs`, { cookie: analyst, body: await charge('check') })
    expect(res.status).toBe(422)
    expect(res.body.data.fields).toEqual([{ path: 'kind', message: expect.stringContaining(`standardise the vessel first: ${v.name} has no accepted energy equivalent`) }])
    const plan = await call('GET', `/api/plans/${planId}`, { cookie: analyst })
    expect(plan.body.runs).toEqual([])
    expect(await auditRows({ action: 'run.create', entityId: planId })).toEqual([])

    // Turning a draft into a check run is refused the same way; a standardisation run is planned as usual.
    const std = await call('POST', `/api/plans/${planId}/runs`, { cookie: analyst, body: await charge('standardisation') })
    expect(std.status).toBe(201)
    const patched = await call('PATCH', `/api/runs/${std.body.id}`, { cookie: analyst, body: { kind: 'check' } })
    expect(patched.status).toBe(422)
    expect(patched.body.data.fields[0].path).toBe('kind')
    expect((await call('GET', `/api/runs/${std.body.id}`, { cookie: analyst })).body.kind).toBe('standardisation')

    // The import preview names the row.
    const csv = `sample_code,kind,mass_g,heating_value_j_per_g,fuse_wire,fuse_length_cm\nCHK-1,check,1,${BA_J_PER_G},nichrome,10\n`
    const imported = await call('POST', `/api/plans/${planId}/import`, { cookie: analyst, body: { csv, commit: false } })
    expect(imported.body.ok).toBe(false)
    expect(imported.body.rows[0].errors.join(' ')).toMatch(/kind: standardise the vessel first/)
  })

  it('plans a check run once the vessel has an accepted energy equivalent', async () => {
    const { vessel } = await standardisedVessel()
    const planId = await planOn(vessel.id)
    const res = await call('POST', `/api/plans/${planId}/runs`, { cookie: await as('analyst'), body: await charge('check') })
    expect(res.status, JSON.stringify(res.body)).toBe(201)
  })
})
