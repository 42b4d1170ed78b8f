import { describe, expect, it } from 'vitest'
import { as, call, DEMO_PASSWORD, signIn, unique } from '../support/api'
import { testDb } from '../support/db'
import { addRun, material, newPlan, newVessel } from '../support/factories'
import { fire, standardisedVessel } from '../unit/bench/bench-api'

// Signatures cover what is fired, signed by someone independent of the charge. Every attempt below goes through the
// routes a browser uses. Heat releases: sample × declared heating value + 10 cm Ni-Cr fuse at 9.6 J/cm (policy,
// from memory) in a vessel rated 33 kJ; approval above 90 % of the rating (policy, common practice).

/** A heating value that puts 0.94 g at 32.9 kJ of a 33 kJ rating: 0.94 × 34,900 + 96 = 32,902 J. */
const HOT_J_PER_G = 34_900
const fuse = { role: 'fuse', wire: 'nichrome', lengthCm: 10 }
// A hydrocarbon by formula (naphthalene, C10H8): no group of UN Appendix 6, Table A6.1 can be in it, so the screen clears it.
const hot = (massG: number, extra: Record<string, unknown> = {}) => ({ sampleCode: unique('HOT'), components: [{ role: 'sample', massG, heatingValueJPerG: HOT_J_PER_G, formula: 'C10H8' }, fuse], ...extra })

async function bothRoles() {
  const email = `${unique('both')}@emberline.test`
  const made = await call('POST', '/api/admin/users', { cookie: await as('admin'), body: { email, name: 'Bo Both', roles: ['analyst', 'supervisor'], password: 'both-roles-2026!' } })
  expect(made.status, JSON.stringify(made.body)).toBe(201)
  return signIn(email, 'both-roles-2026!')
}

const approve = async (runId: string, cookie?: string) => call('POST', `/api/runs/${runId}/approve`, { cookie: cookie ?? await as('supervisor'), body: { password: DEMO_PASSWORD, reason: 'near the rating, reviewed' } })
const submit = async (planId: string, cookie?: string) => call('POST', `/api/plans/${planId}/submit`, { cookie: cookie ?? await as('analyst'), body: {} })
const run = async (id: string) => (await call('GET', `/api/runs/${id}`, { cookie: await as('analyst') })).body

/** A run planned at `massG` of the hot sample, submitted (needs approval) and approved by the supervisor. */
async function signedRun(massG = 0.9, extra: Record<string, unknown> = {}) {
  const v = await newVessel()
  const plan = await newPlan(v.id)
  const r = await addRun(plan.id, hot(massG, extra))
  expect(r.status, JSON.stringify(r.body)).toBe(201)
  expect((await submit(plan.id)).body.runs[0].status).toBe('awaiting-approval')
  const ok = await approve(r.body.id)
  expect(ok.status, JSON.stringify(ok.body)).toBe(200)
  return { vessel: v, plan, run: r.body }
}

describe('separation of duties: two roles in one person', () => {
  it('refuses the approval of a run the signer edited and submitted, whatever roles they hold', async () => {
    const both = await bothRoles()
    const v = await newVessel()
    const plan = await newPlan(v.id)
    const r = await addRun(plan.id, hot(0.9))
    expect(r.status).toBe(201)
    // Another analyst planned it; the person with both roles edits the charge and submits the plan.
    const edited = await call('PATCH', `/api/runs/${r.body.id}`, { cookie: both, body: { components: [{ role: 'sample', massG: 0.91, heatingValueJPerG: HOT_J_PER_G }, fuse] } })
    expect(edited.status, JSON.stringify(edited.body)).toBe(200)
    expect((await submit(plan.id, both)).body.runs[0].status).toBe('awaiting-approval')
    const refused = await approve(r.body.id, both)
    expect(refused.status).toBe(403)
    expect(refused.body.message).toBe('You edited and submitted this run: another supervisor must sign it (separation of duties, whatever roles you hold).')
    const rejected = await call('POST', `/api/runs/${r.body.id}/reject`, { cookie: both, body: { password: 'both-roles-2026!', reason: 'trying to reject' } })
    expect(rejected.status).toBe(403)
    expect((await run(r.body.id)).status).toBe('awaiting-approval')
    // An independent supervisor signs it.
    expect((await approve(r.body.id)).status).toBe(200)
  })

  it('refuses the one who only submitted, before any password is checked', async () => {
    const both = await bothRoles()
    const v = await newVessel()
    const plan = await newPlan(v.id)
    const r = await addRun(plan.id, hot(0.9))
    await submit(plan.id, both)
    const refused = await call('POST', `/api/runs/${r.body.id}/approve`, { cookie: both, body: { password: 'not-the-password', reason: 'looks fine' } })
    expect(refused.status).toBe(403)
    expect(refused.body.message).toMatch(/^You submitted this run/)
  })
})

describe('signatures cover what is fired', () => {
  it('refuses 0.94 g weighed on 0.90 g signed near a 33 kJ rating and sends the run back for a new signature', async () => {
    const { vessel, run: r } = await signedRun(0.9)
    const res = await fire(r.id, { weighedMassG: 0.94 })
    expect(res.status).toBe(409)
    expect(res.body.message).toContain('a supervisor\'s signature is needed again before it is fired')
    expect(res.body.message).toContain('weighed 0.94 g, signed 0.90 g: +4.4 % above the 2 % tolerance')
    const back = await run(r.id)
    expect(back.status).toBe('awaiting-approval')
    expect(back.statusReason).toContain('weighed 0.94 g, signed 0.90 g: +4.4 % above the 2 % tolerance')
    expect(back.signatures.every((s: { current: boolean }) => !s.current)).toBe(true)
    // It shows again in the approvals queue with its reason; nothing was counted.
    const queue = await call('GET', '/api/approvals', { cookie: await as('supervisor') })
    expect(queue.body.find((q: { id: string }) => q.id === r.id)?.statusReason).toContain('+4.4 % above the 2 % tolerance')
    expect((await call('GET', `/api/vessels/${vessel.id}`, { cookie: await as('analyst') })).body.firingsTotal).toBe(0)
    // A new signature covers the weighed charge, which then fires.
    expect((await approve(r.id)).status).toBe(200)
    expect((await fire(r.id, { weighedMassG: 0.94 })).status).toBe(201)
  })

  it('covers a weighed mass within the tolerance (0.91 g on 0.90 g signed: +1.1 %)', async () => {
    const { run: r } = await signedRun(0.9)
    const res = await fire(r.id, { weighedMassG: 0.91 })
    expect(res.status, JSON.stringify(res.body)).toBe(201)
  })

  it('needs a new signature when a finding of the signed charge changes its numbers (more combustion aid weighed)', async () => {
    const ba = await material('Benzoic acid pellet')
    // 0.80 g × 34,900 + 0.10 g × 26,454 (NIST SRM 39j, in air) + 96 = 30,661 J: above 29.7 kJ, approval.
    const { run: r } = await signedRun(0.8, { components: [{ role: 'sample', massG: 0.8, heatingValueJPerG: HOT_J_PER_G }, { role: 'aid', materialId: ba.id, massG: 0.1 }, fuse] })
    // Sample as signed, aid 0.16 g: 32,248 J, the heat release of the finding moves by 5 %.
    const res = await fire(r.id, { weighedMassG: 0.8, aidMassG: 0.16 })
    expect(res.status).toBe(409)
    expect(res.body.message).toMatch(/signature is needed again/)
    expect((await run(r.id)).status).toBe('awaiting-approval')
  })

  it('blocks a signed charge weighed above the rating (a new block finding)', async () => {
    const { run: r } = await signedRun(0.9)
    // 0.96 g: 33,600 J above the 33 kJ rating.
    const res = await fire(r.id, { weighedMassG: 0.96 })
    expect(res.status).toBe(409)
    expect(res.body.data.status).toBe('blocked')
    expect((await run(r.id)).status).toBe('blocked')
  })

  it('sends a cleared run weighed into a new finding to the approvals queue', async () => {
    const v = await newVessel()
    const plan = await newPlan(v.id)
    // 0.80 g: 28,016 J, clear; weighed 0.88 g: 30,808 J, above 90 % of the rating.
    const r = await addRun(plan.id, hot(0.8))
    expect((await submit(plan.id)).body.runs[0].status).toBe('ready')
    const res = await fire(r.body.id, { weighedMassG: 0.88 })
    expect(res.status).toBe(409)
    expect((await run(r.body.id)).status).toBe('awaiting-approval')
  })

  it('refuses a weighed mass below the lab minimum (10 mg) or absurdly small, naming the field', async () => {
    const v = await newVessel()
    const plan = await newPlan(v.id)
    const r = await addRun(plan.id, hot(0.5))
    await submit(plan.id)
    for (const m of [0.005, 1e-300, 0.0099]) {
      const res = await fire(r.body.id, { weighedMassG: m })
      expect(res.status, `${m} g`).toBe(422)
      expect(res.body.data.fields[0].path).toBe('weighedMassG')
    }
    expect((await run(r.body.id)).status).toBe('ready')
    expect((await call('GET', `/api/vessels/${v.id}`, { cookie: await as('analyst') })).body.firingsTotal).toBe(0)
  })
})

describe('standardisation and check runs burn the reference standard', () => {
  it('refuses a check run burning coal, on create, on edit and in the CSV import', async () => {
    const coal = await material('Bituminous coal (typical)')
    const ba = await material('Benzoic acid, calorimetric standard')
    // A vessel with an accepted energy equivalent: a check run is possible on it at all.
    const { vessel: v } = await standardisedVessel()
    const plan = await newPlan(v.id)
    const coalCheck = { sampleCode: unique('CHK'), kind: 'check', components: [{ role: 'sample', materialId: coal.id, massG: 0.8 }, fuse] }
    const created = await addRun(plan.id, coalCheck)
    expect(created.status).toBe(422)
    expect(created.body.data.fields[0]).toEqual({ path: 'components.0.materialId', message: expect.stringContaining('a check run burns the lab\'s reference standard') })
    expect(created.body.message).toContain('Bituminous coal (typical) is a coal, not a reference standard')
    // A sample given only by its heating value is not the reference standard either.
    const anonymous = await addRun(plan.id, { sampleCode: unique('STD'), kind: 'standardisation', components: [{ role: 'sample', massG: 1, heatingValueJPerG: 26_454 }, fuse] })
    expect(anonymous.status).toBe(422)
    // Edit: a sample run of coal turned into a check run.
    const sample = await addRun(plan.id, { ...coalCheck, kind: 'sample' })
    expect(sample.status).toBe(201)
    const edit = await call('PATCH', `/api/runs/${sample.body.id}`, { cookie: await as('analyst'), body: { kind: 'check' } })
    expect(edit.status).toBe(422)
    // Import: the same row in a CSV file is shown as an error and refused on commit.
    const csv = `sample_code,kind,material,mass_g,fuse_wire,fuse_length_cm\n${unique('CHK')},check,${coal.name},0.8,nichrome,10\n`
    const preview = await call('POST', `/api/plans/${plan.id}/import`, { cookie: await as('analyst'), body: { csv } })
    expect(preview.body.ok).toBe(false)
    expect(preview.body.rows[0].errors.join(' ')).toContain('reference standard')
    expect((await call('POST', `/api/plans/${plan.id}/import`, { cookie: await as('analyst'), body: { csv, commit: true } })).status).toBe(422)
    // The certified benzoic acid is accepted.
    const good = await addRun(plan.id, { sampleCode: unique('CHK'), kind: 'check', components: [{ role: 'sample', materialId: ba.id, massG: 1 }, fuse] })
    expect(good.status, JSON.stringify(good.body)).toBe(201)
    // Changing only its mass keeps it a check run (fields left out stay as they were).
    const heavier = await call('PATCH', `/api/runs/${good.body.id}`, { cookie: await as('analyst'), body: { components: [{ role: 'sample', materialId: ba.id, massG: 1.05 }, fuse] } })
    expect(heavier.status).toBe(200)
    expect(heavier.body).toMatchObject({ kind: 'check', note: '' })
  })
})

describe('run numbers', () => {
  it('numbers 20 runs added to one plan at the same instant 1 to 20, each once', async () => {
    const v = await newVessel()
    const plan = await newPlan(v.id)
    const answers = await Promise.all(Array.from({ length: 20 }, () => addRun(plan.id, hot(0.5))))
    expect(answers.map(a => a.status)).toEqual(Array(20).fill(201))
    expect(answers.map(a => a.body.seq).sort((a, b) => a - b)).toEqual(Array.from({ length: 20 }, (_, i) => i + 1))
  })

  it('has a unique index behind the numbering', async () => {
    const { rows } = await testDb().query(`select indexdef from pg_indexes where tablename = 'runs' and indexname = 'runs_plan_seq_unique'`)
    expect(rows[0]?.indexdef).toMatch(/CREATE UNIQUE INDEX .* \(plan_id, seq\)/)
  })
})
