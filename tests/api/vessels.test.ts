import { describe, expect, it } from 'vitest'
import { as, call, unique } from '../support/api'
import { auditRows } from '../support/db'

function vesselBody(over: Record<string, unknown> = {}) {
  return { name: unique('V'), serialNumber: unique('SN'), class: 'standard', ratedEnergyJ: 33000, maxChargeMassG: 1.5, maxFillPressureMPa: 4.05, volumeMl: 300, ...over }
}

describe('vessel register', () => {
  it('lets every role read the register with the computed state and counters', async () => {
    for (const role of ['analyst', 'supervisor', 'technician', 'admin'] as const) {
      const res = await call('GET', '/api/vessels', { cookie: await as(role) })
      expect(res.status).toBe(200)
      expect(res.body.length).toBeGreaterThanOrEqual(4)
    }
    const res = await call('GET', '/api/vessels', { cookie: await as('analyst') })
    const states = new Set(res.body.map((v: { state: string }) => v.state))
    // The demo lab shows the lifecycle: several states, both classes.
    expect(states.size).toBeGreaterThanOrEqual(4)
    expect(new Set(res.body.map((v: { class: string }) => v.class))).toEqual(new Set(['standard', 'high-strength']))
    for (const key of ['state', 'firingsSinceService', 'firingsSinceRequalification', 'firingsTotal', 'lastServicedAt', 'serviceDueAt']) {
      expect(res.body[0]).toHaveProperty(key)
    }
  })

  it('registers a vessel in service with the policy intervals (500 firings, 182 days, 5,000 firings), audited', async () => {
    const admin = await as('admin')
    const res = await call('POST', '/api/vessels', { cookie: admin, body: vesselBody() })
    expect(res.status).toBe(201)
    // Defaults: common practice (manufacturers' service guidance).
    expect(res.body).toMatchObject({ state: 'in-service', serviceIntervalFirings: 500, serviceIntervalDays: 182, requalificationIntervalFirings: 5000, firingsTotal: 0 })
    // Proof charge default: 2 g benzoic acid at 40 atm; 40 atm = 4.053 MPa (NIST SP 811).
    expect(res.body.proofCharge.massG).toBe(2)
    expect(res.body.proofCharge.fillPressureMPa).toBeCloseTo(4.053, 3)
    expect(await auditRows({ action: 'vessel.register', entityId: res.body.id })).toHaveLength(1)
    const got = await call('GET', `/api/vessels/${res.body.id}`, { cookie: await as('technician') })
    expect(got.status).toBe(200)
    expect(got.body.name).toBe(res.body.name)
  })

  it('refuses registration by other roles (403) and bad input (422 naming the fields), creating nothing', async () => {
    expect((await call('POST', '/api/vessels', { cookie: await as('analyst'), body: vesselBody() })).status).toBe(403)
    expect((await call('POST', '/api/vessels', { cookie: await as('supervisor'), body: vesselBody() })).status).toBe(403)
    const body = vesselBody({ ratedEnergyJ: -5, volumeMl: 'large', class: 'titanium' })
    const res = await call('POST', '/api/vessels', { cookie: await as('admin'), body })
    expect(res.status).toBe(422)
    expect(res.body.data.fields.map((f: { path: string }) => f.path)).toEqual(expect.arrayContaining(['ratedEnergyJ', 'volumeMl', 'class']))
    const list = await call('GET', '/api/vessels', { cookie: await as('admin') })
    expect(list.body.some((v: { name: string }) => v.name === body.name)).toBe(false)
  })

  it('refuses a duplicate name or serial number with 409', async () => {
    const admin = await as('admin')
    const first = vesselBody()
    expect((await call('POST', '/api/vessels', { cookie: admin, body: first })).status).toBe(201)
    const res = await call('POST', '/api/vessels', { cookie: admin, body: vesselBody({ serialNumber: first.serialNumber }) })
    expect(res.status).toBe(409)
  })

  it('needs a reason to change a rating, and audits old and new values', async () => {
    const admin = await as('admin')
    const v = (await call('POST', '/api/vessels', { cookie: admin, body: vesselBody() })).body
    const noReason = await call('PATCH', `/api/vessels/${v.id}`, { cookie: admin, body: { ratedEnergyJ: 30000 } })
    expect(noReason.status).toBe(422)
    expect(noReason.body.data.fields[0].path).toBe('reason')
    const ok = await call('PATCH', `/api/vessels/${v.id}`, { cookie: admin, body: { ratedEnergyJ: 30000, reason: 'Rating plate re-read after requalification' } })
    expect(ok.status).toBe(200)
    expect(ok.body.ratedEnergyJ).toBe(30000)
    const rows = await auditRows({ action: 'vessel.ratings-change', entityId: v.id })
    expect(rows).toHaveLength(1)
    expect(rows[0].old_values.ratedEnergyJ).toBe(33000)
    expect(rows[0].new_values.ratedEnergyJ).toBe(30000)
    expect(rows[0].reason).toContain('Rating plate')
    // A note changes without a reason.
    expect((await call('PATCH', `/api/vessels/${v.id}`, { cookie: admin, body: { notes: 'Kept in cabinet 2' } })).status).toBe(200)
    expect((await call('PATCH', `/api/vessels/${v.id}`, { cookie: await as('technician'), body: { notes: 'x' } })).status).toBe(403)
  })

  it('answers 404 for an unknown vessel and 422 for a malformed id', async () => {
    const cookie = await as('analyst')
    expect((await call('GET', '/api/vessels/00000000-0000-4000-8000-000000000001', { cookie })).status).toBe(404)
    expect((await call('GET', '/api/vessels/not-a-uuid', { cookie })).status).toBe(422)
  })
})
