import { beforeAll, describe, expect, it } from 'vitest'
import { as, call, signIn, unique } from '../support/api'
import { auditRows, testDb } from '../support/db'
import { addRun, demoVessel, material, newPlan, newVessel, sampleRun } from '../support/factories'

// Benzoic acid 26,454 J/g weighed in air (NIST SRM 39j certificate); KR-1 is rated 33 kJ (demo vessel record).
// 1.00 g → 26.5 kJ: clear.  1.20 g → 31.7 kJ ≥ 90 % of 33 kJ (policy approvalEnergyFraction): needs approval.
// 1.30 g → 34.4 kJ > 33 kJ: blocked.
let vessel: { id: string }
let plan: { id: string, name: string }

beforeAll(async () => {
  vessel = await demoVessel('KR-1')
  plan = await newPlan(vessel.id)
})

describe('plans and runs', () => {
  it('adds runs assessed on the server and answers { id, status, assessment }', async () => {
    const clear = await addRun(plan.id, sampleRun(1.0))
    expect(clear.status).toBe(201)
    expect(clear.body).toMatchObject({ status: 'draft', verdict: 'clear' })
    expect(clear.body.id).toBeTruthy()
    // Heat release = 1.00 g × 26,454 J/g + 10 cm × 9.6 J/cm (NIST SRM 39j; fuse value from memory, policy default).
    expect(clear.body.assessment.heatReleaseJ).toBeCloseTo(26454 + 96, 0)
    const near = await addRun(plan.id, sampleRun(1.2))
    expect(near.body.verdict).toBe('needs-approval')
    expect(near.body.assessment.findings.map((f: { code: string }) => f.code)).toContain('energy-near-rating')
    const over = await addRun(plan.id, sampleRun(1.3))
    expect(over.body.verdict).toBe('blocked')
    const block = over.body.assessment.findings.find((f: { code: string }) => f.code === 'energy-over-rating')
    // The block says what would make it pass: (33,000 − 96) J / 26,454 J/g = 1.2438 g, rounded down.
    expect(block.message).toMatch(/reduce the sample to ≤ 1\.24 g/)
    expect(await auditRows({ action: 'run.create', entityId: clear.body.id })).toHaveLength(1)
  })

  it('answers a summary of each assessment for the plan page, equal to the stored one apart from the detail', async () => {
    const cookie = await as('analyst')
    const full = await call('GET', `/api/plans/${plan.id}`, { cookie })
    const summary = await call('GET', `/api/plans/${plan.id}?assessment=summary`, { cookie })
    expect(summary.status).toBe(200)
    expect(summary.body.runs.length).toBe(full.body.runs.length)
    expect(summary.body.runs.length).toBeGreaterThan(0)
    for (const [i, run] of full.body.runs.entries()) {
      const { components: _c, suggestions: _s, notes, ...rest } = run.assessment
      expect(notes.length).toBeGreaterThan(0)
      expect(summary.body.runs[i].assessment).toEqual(rest)
      expect(summary.body.runs[i].components).toEqual(run.components)
    }
    expect(JSON.stringify(summary.body).length).toBeLessThan(JSON.stringify(full.body).length / 2)
    const bad = await call('GET', `/api/plans/${plan.id}?assessment=brief`, { cookie })
    expect(bad.status).toBe(422)
    expect(JSON.stringify(bad.body)).toContain('assessment')
  })

  it('fills a component from its material and names an unknown material', async () => {
    const coal = await material('Client coal KRC-2611')
    const ok = await addRun(plan.id, { sampleCode: unique('KRC'), components: [{ role: 'sample', materialId: coal.id, massG: 0.9 }, { role: 'fuse', wire: 'nichrome', lengthCm: 10 }] })
    expect(ok.status).toBe(201)
    expect(ok.body.assessment.components[0].heatingValueSource).toBe('correlation')
    const bad = await addRun(plan.id, { sampleCode: 'X', components: [{ role: 'sample', materialId: '00000000-0000-4000-8000-0000000000aa', massG: 1 }] })
    expect(bad.status).toBe(422)
    expect(bad.body.data.fields[0].path).toBe('components.0.materialId')
  })

  it('refuses bad runs with 422 naming the field, and saves nothing', async () => {
    const before = (await call('GET', `/api/plans/${plan.id}`, { cookie: await as('analyst') })).body.runs.length
    const neg = await addRun(plan.id, { sampleCode: 'N', components: [{ role: 'sample', massG: -1, heatingValueJPerG: 20000 }] })
    expect(neg.status).toBe(422)
    expect(neg.body.data.fields.map((f: { path: string }) => f.path)).toContain('components.0.massG')
    const none = await addRun(plan.id, { sampleCode: 'N', components: [] })
    expect(none.status).toBe(422)
    const noCode = await addRun(plan.id, { components: [{ role: 'sample', massG: 1, heatingValueJPerG: 20000 }] })
    expect(noCode.body.data.fields.map((f: { path: string }) => f.path)).toContain('sampleCode')
    const after = (await call('GET', `/api/plans/${plan.id}`, { cookie: await as('analyst') })).body.runs.length
    expect(after).toBe(before)
  })

  it('lets only analysts plan', async () => {
    expect((await call('POST', '/api/plans', { cookie: await as('technician'), body: { name: 'x', vesselId: vessel.id, fillPressureMPa: 3 } })).status).toBe(403)
    expect((await addRun(plan.id, sampleRun(1), await as('supervisor'))).status).toBe(403)
    expect((await call('GET', `/api/plans/${plan.id}`, { cookie: await as('technician') })).status).toBe(403)
    expect((await call('POST', '/api/plans', { cookie: await as('analyst'), body: { name: 'x', vesselId: '00000000-0000-4000-8000-0000000000bb', fillPressureMPa: 3 } })).status).toBe(422)
  })

  it('submits: clear → ready, needs approval → awaiting-approval, blocked → blocked; one mail to supervisors per plan', async () => {
    const res = await call('POST', `/api/plans/${plan.id}/submit`, { cookie: await as('analyst'), body: {} })
    expect(res.status).toBe(200)
    expect(res.body.counts).toMatchObject({ 'ready': 2, 'awaiting-approval': 1, 'blocked': 1 })
    const { rows } = await testDb().query(`select * from mail_outbox where subject like $1`, [`%${plan.name}%`])
    expect(rows).toHaveLength(1)
    expect(rows[0].to).toContain('supervisor@emberline.test')
    expect((await call('POST', `/api/plans/${plan.id}/submit`, { cookie: await as('analyst'), body: {} })).status).toBe(409)
  })

  it('refuses to submit a run without a planned sample mass', async () => {
    const p = await newPlan(vessel.id)
    await addRun(p.id, { sampleCode: 'NOMASS', components: [{ role: 'sample', heatingValueJPerG: 26454, smiles: 'OC(=O)c1ccccc1' }] })
    const res = await call('POST', `/api/plans/${p.id}/submit`, { cookie: await as('analyst'), body: {} })
    expect(res.status).toBe(422)
    expect(res.body.data.fields[0].path).toBe('runs.1.massG')
  })

  it('blocks a sample run on a locked-out vessel and says why', async () => {
    const locked = await demoVessel('KR-5')
    const p = await newPlan(locked.id)
    const run = await addRun(p.id, sampleRun(0.8))
    expect(run.body.verdict).toBe('blocked')
    expect(run.body.assessment.findings.map((f: { code: string }) => f.code)).toContain('vessel-locked-out')
  })

  it('withdraws and duplicates runs; a withdrawn run cannot change', async () => {
    const p = await newPlan(vessel.id)
    const run = (await addRun(p.id, sampleRun(0.9))).body
    const dup = await call('POST', `/api/runs/${run.id}/duplicate`, { cookie: await as('analyst'), body: {} })
    expect(dup.status).toBe(201)
    expect(dup.body).toMatchObject({ sampleCode: run.sampleCode, seq: 2, status: 'draft' })
    expect((await call('POST', `/api/runs/${run.id}/withdraw`, { cookie: await as('analyst'), body: { reason: 'sample spilt' } })).body.status).toBe('withdrawn')
    expect((await call('PATCH', `/api/runs/${run.id}`, { cookie: await as('analyst'), body: { sampleCode: 'again' } })).status).toBe(409)
  })
})

describe('approvals with electronic signatures', () => {
  let waiting: { id: string, chargeHash: string }
  let blocked: { id: string }
  beforeAll(async () => {
    const p = await newPlan(vessel.id)
    waiting = (await addRun(p.id, sampleRun(1.2))).body
    blocked = (await addRun(p.id, sampleRun(1.3))).body
    await call('POST', `/api/plans/${p.id}/submit`, { cookie: await as('analyst'), body: {} })
    waiting = (await call('GET', `/api/runs/${waiting.id}`, { cookie: await as('supervisor') })).body
  })

  it('lists the waiting run in the queue with its findings', async () => {
    const q = await call('GET', '/api/approvals', { cookie: await as('supervisor') })
    const mine = q.body.find((r: { id: string }) => r.id === waiting.id)
    expect(mine.findings ?? mine.assessment.findings).toBeTruthy()
    expect(mine.plannerName).toBe('Mira Okafor')
    expect((await call('GET', '/api/approvals', { cookie: await as('analyst') })).status).toBe(403)
  })

  it('refuses analysts and technicians (403), a wrong password (403, audited), a missing reason (422) and a blocked run (409)', async () => {
    const body = { password: 'ember-demo-2026', reason: 'Energy within rating; vessel recently serviced' }
    expect((await call('POST', `/api/runs/${waiting.id}/approve`, { cookie: await as('analyst'), body })).status).toBe(403)
    expect((await call('POST', `/api/runs/${waiting.id}/approve`, { cookie: await as('technician'), body })).status).toBe(403)
    const wrong = await call('POST', `/api/runs/${waiting.id}/approve`, { cookie: await as('supervisor'), body: { ...body, password: 'nope' } })
    expect(wrong.status).toBe(403)
    expect(await auditRows({ action: 'signature.password-wrong', entityId: waiting.id })).toHaveLength(1)
    expect((await call('POST', `/api/runs/${waiting.id}/approve`, { cookie: await as('supervisor'), body: { password: 'ember-demo-2026' } })).status).toBe(422)
    expect((await call('POST', `/api/runs/${blocked.id}/approve`, { cookie: await as('supervisor'), body })).status).toBe(409)
  })

  it('refuses a signature bound to a charge that has since changed', async () => {
    const res = await call('POST', `/api/runs/${waiting.id}/approve`, { cookie: await as('supervisor'), body: { password: 'ember-demo-2026', reason: 'looks fine', chargeHash: 'f'.repeat(64) } })
    expect(res.status).toBe(409)
  })

  it('approves: run → ready, signature with name, time and meaning, audit row, mail to the analyst', async () => {
    const res = await call('POST', `/api/runs/${waiting.id}/approve`, { cookie: await as('supervisor'), body: { password: 'ember-demo-2026', reason: 'Within rating; duplicate planned', chargeHash: waiting.chargeHash } })
    expect(res.status).toBe(200)
    expect(res.body.status).toBe('ready')
    expect(res.body.signatures[0]).toMatchObject({ signerName: 'Helena Ruiz', meaning: 'approved as an exception', current: true })
    const rows = await auditRows({ action: 'run.approve', entityId: waiting.id })
    expect(rows).toHaveLength(1)
    expect(rows[0].reason).toContain('Within rating')
    const mail = await testDb().query(`select * from mail_outbox where dedupe_key = $1`, [`run-decision:${res.body.signatures[0].id}`])
    expect(mail.rows[0].to).toEqual(['analyst@emberline.test'])
    // Approving twice is refused: the run is no longer waiting.
    expect((await call('POST', `/api/runs/${waiting.id}/approve`, { cookie: await as('supervisor'), body: { password: 'ember-demo-2026', reason: 'again' } })).status).toBe(409)
  })

  it('keeps separation of duties: whoever planned a run cannot sign it', async () => {
    const admin = await as('admin')
    const email = `${unique('dual')}@emberline.test`
    await call('POST', '/api/admin/users', { cookie: admin, body: { email, name: 'Dual Role', roles: ['analyst', 'supervisor'], password: 'dual role password' } })
    const dual = await signIn(email, 'dual role password')
    const p = await newPlan(vessel.id, dual)
    const run = (await addRun(p.id, sampleRun(1.2), dual)).body
    await call('POST', `/api/plans/${p.id}/submit`, { cookie: dual, body: {} })
    const res = await call('POST', `/api/runs/${run.id}/approve`, { cookie: dual, body: { password: 'dual role password', reason: 'mine' } })
    expect(res.status).toBe(403)
    expect(res.body.message).toMatch(/separation of duties/)
  })

  it('rejects: run → rejected; an edited run goes back to draft and needs a new request', async () => {
    const p = await newPlan(vessel.id)
    const run = (await addRun(p.id, sampleRun(1.2))).body
    await call('POST', `/api/plans/${p.id}/submit`, { cookie: await as('analyst'), body: {} })
    const rej = await call('POST', `/api/runs/${run.id}/reject`, { cookie: await as('supervisor'), body: { password: 'ember-demo-2026', reason: 'Use a smaller mass' } })
    expect(rej.body.status).toBe('rejected')
    expect(rej.body.signatures[0].meaning).toBe('rejected')
    const edited = await call('PATCH', `/api/runs/${run.id}`, { cookie: await as('analyst'), body: { components: sampleRun(1.0).components } })
    expect(edited.body).toMatchObject({ status: 'draft', verdict: 'clear' })
    expect(edited.body.signatures[0].current).toBe(false)
  })
})

describe('CSV import', () => {
  it('previews every row with its verdict, then adds all rows in one go', async () => {
    const v = await newVessel()
    const p = await newPlan(v.id)
    const csv = [
      'sample_code,material,mass_g,heating_value_j_per_g,smiles,fuse_wire,fuse_length_cm',
      'A-1,,1.0,26454,OC(=O)c1ccccc1,nichrome,10',
      'A-2,Client coal KRC-2611 (bituminous blend),0.9,,,nichrome,10',
      'A-3,,1.3,26454,OC(=O)c1ccccc1,nichrome,10',
    ].join('\n')
    const preview = await call('POST', `/api/plans/${p.id}/import`, { cookie: await as('analyst'), body: { csv } })
    expect(preview.status).toBe(200)
    expect(preview.body.ok).toBe(true)
    expect(preview.body.rows.map((r: { verdict: string }) => r.verdict)).toEqual(['clear', 'clear', 'blocked'])
    expect((await call('GET', `/api/plans/${p.id}`, { cookie: await as('analyst') })).body.runs).toHaveLength(0)
    const commit = await call('POST', `/api/plans/${p.id}/import`, { cookie: await as('analyst'), body: { csv, commit: true } })
    expect(commit.body).toMatchObject({ ok: true, committed: true, created: 3 })
    expect((await call('GET', `/api/plans/${p.id}`, { cookie: await as('analyst') })).body.runs).toHaveLength(3)
  })

  it('names what to fix on each bad row and saves nothing, even when asked to commit', async () => {
    const v = await newVessel()
    const p = await newPlan(v.id)
    const csv = [
      'sample_code,material,mass_g,fuse_wire,fuse_length_cm',
      'B-1,Unobtainium,1.0,nichrome,10',
      'B-2,Client coal KRC-2611 (bituminous blend),heavy,nichrome,10',
      ',Client coal KRC-2611 (bituminous blend),0.8,copper,10',
      'B-4,Client coal KRC-2611 (bituminous blend),0.8,nichrome,10',
    ].join('\n')
    const res = await call('POST', `/api/plans/${p.id}/import`, { cookie: await as('analyst'), body: { csv, commit: true } })
    expect(res.status).toBe(422)
    expect(res.body.ok).toBe(false)
    const errs = Object.fromEntries(res.body.rows.map((r: { line: number, errors: string[] }) => [r.line, r.errors.join(' | ')]))
    expect(errs[2]).toMatch(/Unobtainium.*not in the materials library/)
    expect(errs[3]).toMatch(/mass_g "heavy" is not a number/)
    expect(errs[4]).toMatch(/sample_code is empty/)
    expect(errs[4]).toMatch(/fuse_wire "copper"/)
    expect(errs[5]).toBe('')
    expect((await call('GET', `/api/plans/${p.id}`, { cookie: await as('analyst') })).body.runs).toHaveLength(0)
  })

  it('refuses a file without the header and serves the template', async () => {
    const v = await newVessel()
    const p = await newPlan(v.id)
    const res = await call('POST', `/api/plans/${p.id}/import`, { cookie: await as('analyst'), body: { csv: 'A-1,1.0\nA-2,0.9' } })
    expect(res.body.ok).toBe(false)
    expect(res.body.fileErrors[0]).toMatch(/header/)
    const tpl = await call('GET', '/api/plans/import-template.csv', { cookie: await as('analyst') })
    expect(tpl.status).toBe(200)
    expect(tpl.headers.get('content-disposition')).toMatch(/attachment/)
    expect(String(tpl.body)).toMatch(/^sample_code,kind,material,mass_g/)
  })
})
