import { beforeAll, describe, expect, it } from 'vitest'
import { as, call } from '../support/api'
import { auditRows, testDb } from '../support/db'
import { demoVessel, material, newPlan } from '../support/factories'
import { newClient, receive } from '../support/samples'

let client: { id: string, name: string }
beforeAll(async () => { client = await newClient() })

describe('clients register', () => {
  it('lets supervisors and admins register clients, everyone read them, with an audit row', async () => {
    const c = await newClient({ name: `Harrow Biomass ${Date.now()}` })
    expect((await auditRows({ action: 'client.create', entityId: c.id }))).toHaveLength(1)
    const dup = await call('POST', '/api/clients', { cookie: await as('admin'), body: { name: c.name.toUpperCase().replace(' ', '  ') } })
    expect(dup.status).toBe(409)
    expect((await call('POST', '/api/clients', { cookie: await as('analyst'), body: { name: 'X' } })).status).toBe(403)
    const list = await call('GET', '/api/clients', { cookie: await as('technician') })
    expect(list.body.map((x: { id: string }) => x.id)).toContain(c.id)
    const bad = await call('POST', '/api/clients', { cookie: await as('supervisor'), body: { name: '  ', contactEmail: 'not-mail' } })
    expect(bad.status).toBe(422)
    expect(bad.body.data.fields.map((f: { path: string }) => f.path).sort()).toEqual(['contactEmail', 'name'])
  })
})

describe('sample receipt', () => {
  it('generates a unique lab code in the lab\'s format and writes an audit row', async () => {
    const a = await receive(client.id)
    const b = await receive(client.id, {}, 'supervisor')
    // Demo lab "Kestrel Ridge Fuels Laboratory" → prefix KR; year of receipt; five-digit running number.
    expect(a.labCode).toMatch(/^KR-\d{4}-\d{5}$/)
    expect(a.status).toBe('received')
    expect(Number(b.labCode.slice(-5))).toBeGreaterThan(Number(a.labCode.slice(-5)))
    expect(await auditRows({ action: 'sample.receive', entityId: a.id })).toHaveLength(1)
  })

  it('never reuses a number, even after a receipt that failed', async () => {
    const before = await receive(client.id)
    const failed = await call('POST', '/api/samples', { cookie: await as('analyst'), body: { clientId: '00000000-0000-4000-8000-0000000000aa', description: 'x', receivedAt: new Date().toISOString() } })
    expect(failed.status).toBe(422)
    const after = await receive(client.id)
    expect(Number(after.labCode.slice(-5))).toBeGreaterThan(Number(before.labCode.slice(-5)))
    const { rows } = await testDb().query('select lab_code, count(*) from samples group by lab_code having count(*) > 1')
    expect(rows).toEqual([])
  })

  it('refuses bad receipts naming each field, and saves nothing', async () => {
    const { rows: [{ n: before }] } = await testDb().query('select count(*)::int as n from samples')
    const bad = await call('POST', '/api/samples', { cookie: await as('analyst'), body: { clientId: 'nope', description: '', receivedAt: '2026-13-45', receivedMassG: -3 } })
    expect(bad.status).toBe(422)
    expect(bad.body.data.fields.map((f: { path: string }) => f.path).sort()).toEqual(['clientId', 'description', 'receivedAt', 'receivedMassG'])
    const future = await call('POST', '/api/samples', { cookie: await as('analyst'), body: { clientId: client.id, description: 'x', receivedAt: new Date(Date.now() + 86_400_000).toISOString() } })
    expect(future.status).toBe(422)
    expect(future.body.data.fields[0].path).toBe('receivedAt')
    const noMaterial = await call('POST', '/api/samples', { cookie: await as('analyst'), body: { clientId: client.id, description: 'x', receivedAt: new Date().toISOString(), materialId: '00000000-0000-4000-8000-0000000000aa' } })
    expect(noMaterial.body.data.fields[0].path).toBe('materialId')
    const notJson = await call('POST', '/api/samples', { cookie: await as('analyst'), raw: 'clientId=1', headers: { 'content-type': 'application/x-www-form-urlencoded' } })
    expect(notJson.status).toBe(415)
    const { rows: [{ n: after }] } = await testDb().query('select count(*)::int as n from samples')
    expect(after).toBe(before)
  })

  it('lets analysts and supervisors receive, not technicians or admins', async () => {
    const body = { clientId: client.id, description: 'x', receivedAt: new Date().toISOString() }
    expect((await call('POST', '/api/samples', { cookie: await as('technician'), body })).status).toBe(403)
    expect((await call('POST', '/api/samples', { cookie: await as('admin'), body })).status).toBe(403)
  })

  it('rejects at receipt with a reason, once, and only while waiting', async () => {
    const s = await receive(client.id)
    const noReason = await call('POST', `/api/samples/${s.id}/reject`, { cookie: await as('analyst'), body: { reason: '' } })
    expect(noReason.status).toBe(422)
    const ok = await call('POST', `/api/samples/${s.id}/reject`, { cookie: await as('analyst'), body: { reason: 'container leaking, sample wet' } })
    expect(ok.body).toMatchObject({ status: 'rejected', rejectionReason: 'container leaking, sample wet' })
    expect((await call('POST', `/api/samples/${s.id}/reject`, { cookie: await as('analyst'), body: { reason: 'again please' } })).status).toBe(409)
    expect(await auditRows({ action: 'sample.reject', entityId: s.id })).toHaveLength(1)
  })

  it('stores a photo taken at receipt, checked from its content, visible to other users', async () => {
    const s = await receive(client.id)
    const png = Buffer.from('89504E470D0A1A0A0000000D49484452000000010000000108060000001F15C4890000000D49444154789C6360000002000154A24F5D0000000049454E44AE426082', 'hex')
    const form = new FormData()
    form.append('files', new Blob([png], { type: 'image/png' }), 'jar.png')
    const { baseURL } = await import('../support/api')
    const res = await fetch(`${baseURL()}/api/samples/${s.id}/photos`, { method: 'POST', body: form, headers: { cookie: await as('analyst') } })
    expect(res.status).toBe(201)
    const [photo] = await res.json()
    const seen = await fetch(`${baseURL()}${photo.url}`, { headers: { cookie: await as('supervisor') } })
    expect(seen.status).toBe(200)
    const exe = new FormData()
    exe.append('files', new Blob([Buffer.from('MZ\x90\x00')], { type: 'image/png' }), 'jar.png')
    expect((await fetch(`${baseURL()}/api/samples/${s.id}/photos`, { method: 'POST', body: exe, headers: { cookie: await as('analyst') } })).status).toBe(422)
  })
})

describe('the queue', () => {
  it('lists waiting samples oldest first with their age and material, filtered by client and category', async () => {
    const c = await newClient()
    const oats = await material('Rolled oat flakes')
    const coal = await material('Client coal KRC-2611')
    const hour = 3_600_000
    const old = await receive(c.id, { materialId: oats.id, receivedAt: new Date(Date.now() - 50 * hour).toISOString() })
    const mid = await receive(c.id, { materialId: coal.id, receivedAt: new Date(Date.now() - 30 * hour).toISOString() })
    const fresh = await receive(c.id, { receivedAt: new Date(Date.now() - 2 * hour).toISOString() })
    const q = await call('GET', `/api/samples?status=received&clientId=${c.id}`, { cookie: await as('analyst') })
    expect(q.body.rows.map((r: { id: string }) => r.id)).toEqual([old.id, mid.id, fresh.id])
    expect(q.body.rows[0]).toMatchObject({ materialName: oats.name, materialCategory: 'food', clientName: c.name })
    expect(q.body.rows[0].ageHours).toBeGreaterThanOrEqual(49)
    const food = await call('GET', `/api/samples?status=received&clientId=${c.id}&category=food`, { cookie: await as('analyst') })
    expect(food.body.rows.map((r: { id: string }) => r.id)).toEqual([old.id])
    expect((await call('GET', '/api/samples?status=lost', { cookie: await as('analyst') })).status).toBe(422)
  })

  it('finds a sample by its lab code as a scanner types it', async () => {
    const s = await receive(client.id)
    const hit = await call('GET', `/api/search?q=${encodeURIComponent(` ${s.labCode.toLowerCase()} `)}`, { cookie: await as('technician') })
    expect(hit.body).toMatchObject({ kind: 'sample', id: s.id, to: `/samples/${s.id}` })
    expect((await call('GET', '/api/search?q=KR-1999-99999', { cookie: await as('analyst') })).status).toBe(404)
  })
})

describe('plan from the queue', () => {
  it('makes two linked runs per sample with the suggested mass, and marks the samples planned, in one go', async () => {
    const vessel = await demoVessel('KR-1')
    const plan = await newPlan(vessel.id)
    const oats = await material('Rolled oat flakes')
    const a = await receive(client.id, { materialId: oats.id })
    const b = await receive(client.id, { materialId: oats.id })
    const res = await call('POST', `/api/plans/${plan.id}/from-samples`, { cookie: await as('analyst'), body: { sampleIds: [a.id, b.id] } })
    expect(res.status, JSON.stringify(res.body)).toBe(201)
    // Duplicates by default (lab policy determinationsPerSample = 2; ISO 1928 reports the mean of duplicates, from memory).
    expect(res.body.runs).toHaveLength(4)
    const { rows } = await testDb().query('select sample_id, sample_code, components from runs where plan_id = $1 order by seq', [plan.id])
    expect(rows.map(r => r.sample_id)).toEqual([a.id, a.id, b.id, b.id])
    expect(rows[0].sample_code).toBe(a.labCode)
    // Suggested mass: (target 26,000 J − fuse 10 cm × 9.6 J/cm) / 17,800 J/g = 1.455 g → 1.45 g (policy target, [C]).
    expect(rows[0].components[0]).toMatchObject({ role: 'sample', materialId: oats.id, massG: 1.45 })
    for (const id of [a.id, b.id]) {
      expect((await call('GET', `/api/samples/${id}`, { cookie: await as('analyst') })).body).toMatchObject({ status: 'planned' })
      expect(await auditRows({ action: 'sample.plan', entityId: id })).toHaveLength(1)
    }
    const detail = await call('GET', `/api/samples/${a.id}`, { cookie: await as('analyst') })
    expect(detail.body.runs).toHaveLength(2)
    // A planned sample is no longer in the queue and cannot be planned twice.
    const again = await call('POST', `/api/plans/${plan.id}/from-samples`, { cookie: await as('analyst'), body: { sampleIds: [a.id] } })
    expect(again.status).toBe(422)
    expect(again.body.data.fields[0].path).toBe('sampleIds.0')
  })

  it('plans a sample once when two analysts plan it at the same moment', async () => {
    const vessel = await demoVessel('KR-1')
    const [p1, p2] = [await newPlan(vessel.id), await newPlan(vessel.id, await as('analyst2'))]
    const s = await receive(client.id)
    const [a, b] = await Promise.all([
      call('POST', `/api/plans/${p1.id}/from-samples`, { cookie: await as('analyst'), body: { sampleIds: [s.id] } }),
      call('POST', `/api/plans/${p2.id}/from-samples`, { cookie: await as('analyst2'), body: { sampleIds: [s.id] } }),
    ])
    expect([a.status, b.status].sort()).toEqual([201, 422])
    const { rows } = await testDb().query('select count(*)::int as n from runs where sample_id = $1', [s.id])
    expect(rows[0].n).toBe(2)
  })

  it('refuses a time of receipt without its time zone', async () => {
    const res = await call('POST', '/api/samples', { cookie: await as('analyst'), body: { clientId: client.id, description: 'x', receivedAt: '2026-12-01T10:00' } })
    expect(res.status).toBe(422)
    expect(res.body.data.fields[0].path).toBe('receivedAt')
  })

  it('honours a number of determinations and changes nothing when one sample is wrong', async () => {
    const vessel = await demoVessel('KR-2')
    const plan = await newPlan(vessel.id)
    const a = await receive(client.id)
    const res = await call('POST', `/api/plans/${plan.id}/from-samples`, { cookie: await as('analyst'), body: { sampleIds: [a.id, '00000000-0000-4000-8000-0000000000aa'], determinations: 3 } })
    expect(res.status).toBe(422)
    expect((await call('GET', `/api/samples/${a.id}`, { cookie: await as('analyst') })).body.status).toBe('received')
    const ok = await call('POST', `/api/plans/${plan.id}/from-samples`, { cookie: await as('analyst'), body: { sampleIds: [a.id], determinations: 3 } })
    expect(ok.body.runs).toHaveLength(3)
    // No material: the identity is unknown, so the charge needs a signature (screening finding).
    expect(ok.body.runs[0].verdict).not.toBe('clear')
    expect((await call('POST', `/api/plans/${plan.id}/from-samples`, { cookie: await as('supervisor'), body: { sampleIds: [a.id] } })).status).toBe(403)
  })
})
