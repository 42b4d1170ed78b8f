import { beforeAll, describe, expect, it } from 'vitest'
import { previewResult } from '../../shared/domain/results'
import type { ResultContextParts, ResultValues } from '../../shared/domain/results'
import type { LabPolicy } from '../../shared/domain/policy'
import { as, call, unique } from '../support/api'
import { BA_J_PER_G, FUSE_10CM_J, benzoicAcidId, fire, readyRuns, standardisedVessel } from '../unit/bench/bench-api'

// The result form previews a result in the browser with previewResult on the parts GET /api/runs/[id]/result-context
// answers and the policy GET /api/settings answers; the server then stores computeResultValues of the same body.
// The two must be the same figures, to the last bit. ε = 10 000 J/K from five benzoic-acid runs (ASTM D240 §8).
const FUSE = { wire: 'nichrome', burntLengthCm: 10 }
const EPS = 10_000

let vesselId: string
let ba: string
let capsuleId: string
let policy: LabPolicy
beforeAll(async () => {
  vesselId = (await standardisedVessel([10_000, 10_003, 9_997, 10_001, 9_999])).vessel.id
  ba = await benzoicAcidId()
  const analyst = await as('analyst')
  const mats = await call('GET', '/api/materials?q=Gelatin%20capsule&limit=50&derived=0', { cookie: analyst })
  capsuleId = mats.body.rows.find((m: { name: string }) => m.name === 'Gelatin capsule (combustion aid)').id
  policy = (await call('GET', '/api/settings', { cookie: analyst })).body.policy
})

async function firedRun(spec: Record<string, unknown> = {}, m = 0.8) {
  const [run] = await readyRuns(vesselId, [{ sampleCode: unique('PV'), materialId: ba, massG: m, ...spec }])
  expect((await fire(run!.id, { weighedMassG: m })).status).toBe(201)
  return run!
}

async function previewThenSave(runId: string, body: Record<string, unknown>) {
  const ctx = await call('GET', `/api/runs/${runId}/result-context`, { cookie: await as('analyst') })
  expect(ctx.status, JSON.stringify(ctx.body)).toBe(200)
  const preview = previewResult(body, ctx.body as ResultContextParts, policy)
  if (!preview.ok) throw new Error(JSON.stringify(preview.problems))
  const saved = await call('POST', `/api/runs/${runId}/result`, { cookie: await as('analyst'), body })
  expect(saved.status, JSON.stringify(saved.body)).toBe(201)
  return { preview: JSON.parse(JSON.stringify(preview.values)) as ResultValues, saved: saved.body.result }
}

describe('the preview on the result form is the result the server stores', () => {
  it('a 3 % S sample with nitric acid as mol HNO3, on every basis with net values (ISO 1928 convention, 94.2 J per % S × g)', async () => {
    const run = await firedRun()
    const body = {
      temperatureRiseK: (0.8 * BA_J_PER_G + FUSE_10CM_J) / EPS, fuse: FUSE, acid: { nitricAcidMol: 0.0008 }, sulfurPct: 3,
      moistureAdPct: 1.2, moistureArPct: 6, ashDryPct: 9, hydrogenDryPct: 4.8, oxygenDryPct: 7, nitrogenDryPct: 1.4,
    }
    const { preview, saved } = await previewThenSave(run.id, body)
    expect(saved.values).toEqual(preview)
    expect(preview.corrections.sulfurJPerPctG).toBe(94.2)
    expect(Object.keys(preview.expandedUncertaintyByBasis!.netConstantPressure).sort()).toEqual(['air-dried', 'as-received', 'dry'])
  })

  it('a capsule at a typical value: the preview says provisional, as the stored result does', async () => {
    const run = await firedRun({ aidMassG: 0.1, aidMaterialId: capsuleId })
    // 18 500 J/g typed without its uncertainty counts as typical (± 5 % rectangular, common practice), whatever the
    // lab has determined for the capsule meanwhile.
    const body = { temperatureRiseK: (0.8 * BA_J_PER_G + FUSE_10CM_J + 0.1 * 18_500) / EPS, fuse: FUSE, moistureAdPct: 0, aidMassG: 0.1, aidHeatingValueJPerG: 18_500 }
    const { preview, saved } = await previewThenSave(run.id, body)
    expect(preview.provisional.length).toBeGreaterThan(0)
    expect(saved.values).toEqual(preview)
  })

  it('the capsule\'s value in force (library typical range or the lab\'s accepted series) is the one the preview uses', async () => {
    const run = await firedRun({ aidMassG: 0.1, aidMaterialId: capsuleId })
    const body = { temperatureRiseK: (0.8 * BA_J_PER_G + FUSE_10CM_J + 0.1 * 18_500) / EPS, fuse: FUSE, moistureAdPct: 0, aidMassG: 0.1 }
    const { preview, saved } = await previewThenSave(run.id, body)
    expect(saved.values).toEqual(preview)
    expect(preview.provisional.length > 0).toBe(preview.corrections.aidValueSource === 'typical')
  })

  it('a revision previews with the ε of its first revision, and stores what it previewed', async () => {
    const run = await firedRun()
    const first = await previewThenSave(run.id, { temperatureRiseK: (0.8 * BA_J_PER_G + FUSE_10CM_J) / EPS, fuse: FUSE, moistureAdPct: 0 })
    const body = { temperatureRiseK: 2.2, fuse: FUSE, moistureAdPct: 0, acid: { titrantMl: 10, titrantJPerMl: 4.33 }, sulfurPct: 1.5 }
    const ctx = await call('GET', `/api/runs/${run.id}/result-context`, { cookie: await as('supervisor') })
    expect(ctx.status).toBe(200)
    expect(ctx.body.energyEquivalent.id).toBe(first.saved.energyEquivalentId)
    const preview = previewResult(body, ctx.body, policy)
    expect(preview.ok).toBe(true)
    const revised = await call('POST', `/api/results/${first.saved.id}/revise`, { cookie: await as('analyst'), body: { ...body, reason: 'titration entered' } })
    expect(revised.status, JSON.stringify(revised.body)).toBe(201)
    expect(revised.body.result.values).toEqual(JSON.parse(JSON.stringify(preview.ok && preview.values)))
    // ASTM convention after a total-acid titration: 57.5 J per (% S × g) (ASTM D5865 / D240).
    expect(revised.body.result.values.corrections.sulfurJPerPctG).toBe(57.5)
  })

  it('names what is missing the way the server\'s 422 does, and answers 409 for a run not fired', async () => {
    const run = await firedRun()
    const ctx = await call('GET', `/api/runs/${run.id}/result-context`, { cookie: await as('analyst') })
    const preview = previewResult({ fuse: FUSE }, ctx.body, policy)
    expect(preview.ok).toBe(false)
    const refused = await call('POST', `/api/runs/${run.id}/result`, { cookie: await as('analyst'), body: { fuse: FUSE } })
    expect(refused.status).toBe(422)
    expect(!preview.ok && preview.problems.map(p => p.path)).toEqual(refused.body.data.fields.map((f: { path: string }) => f.path))

    const [waiting] = await readyRuns(vesselId, [{ sampleCode: unique('PV'), materialId: ba, massG: 0.8 }])
    expect((await call('GET', `/api/runs/${waiting!.id}/result-context`, { cookie: await as('analyst') })).status).toBe(409)
    expect((await call('GET', `/api/runs/${waiting!.id}/result-context`, { cookie: await as('technician') })).status).toBe(403)
  })
})
