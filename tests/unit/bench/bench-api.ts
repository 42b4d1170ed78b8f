// Small factories for the bench API tests: a dedicated vessel, cleared runs, a firing, a result.
// Everything goes through the API as a person would (tests/support/api.ts); nothing is written to the database directly.
import { randomUUID } from 'node:crypto'
import { expect } from 'vitest'
import { as, call, unique } from '../../support/api'

export const PASSWORD = 'ember-demo-2026'
/** Benzoic acid weighed in air, NIST SRM 39j certificate (as in the reference material of the library). */
export const BA_J_PER_G = 26_454
/** 10 cm of nickel-chromium wire at the policy's 9.6 J/cm (from memory). */
export const FUSE_10CM_J = 96

export async function registerVessel(over: Record<string, unknown> = {}) {
  const res = await call('POST', '/api/vessels', {
    cookie: await as('admin'),
    body: {
      name: unique('T-vessel'), serialNumber: unique('SN'), class: 'standard', ratedEnergyJ: 33_000, maxChargeMassG: 1.5, maxFillPressureMPa: 4.05, volumeMl: 300,
      serviceIntervalFirings: 100_000, requalificationIntervalFirings: 1_000_000, ...over,
    },
  })
  expect(res.status, JSON.stringify(res.body)).toBe(201)
  return res.body as { id: string, name: string, state: string, firingsSinceService: number, firingsSinceRequalification: number, firingsTotal: number }
}

export async function vessel(id: string) {
  return (await call('GET', `/api/vessels/${id}`, { cookie: await as('analyst') })).body
}

let baId: string | undefined
/** The library's certified benzoic acid (heating value 26 454 J/g, formula C7H6O2). */
export async function benzoicAcidId(): Promise<string> {
  if (baId) return baId
  const res = await call('GET', '/api/materials?q=Benzoic%20acid&limit=50&derived=0', { cookie: await as('analyst') })
  baId = res.body.rows.find((m: { name: string }) => m.name === 'Benzoic acid, calorimetric standard').id
  return baId!
}

export interface RunSpec { sampleCode?: string, kind?: 'sample' | 'standardisation' | 'check', massG?: number, heatingValueJPerG?: number, materialId?: string, aidMassG?: number, aidMaterialId?: string, smiles?: string }

/** A plan on the vessel with one run per spec, submitted; returns the runs with their status after submission. */
export async function plannedRuns(vesselId: string, specs: RunSpec[], cookie?: string) {
  const analyst = cookie ?? await as('analyst')
  const plan = await call('POST', '/api/plans', { cookie: analyst, body: { name: unique('plan'), vesselId, fillPressureMPa: 3.0 } })
  expect(plan.status).toBe(201)
  const aidId = specs.some(s => s.aidMassG) ? await benzoicAcidId() : undefined
  const runs: { id: string, sampleCode: string }[] = []
  for (const s of specs) {
    // Standardisation and check runs burn the library's reference standard (the certified benzoic acid).
    const materialId = s.materialId ?? (s.kind && s.kind !== 'sample' ? await benzoicAcidId() : undefined)
    const sample = materialId
      ? { role: 'sample', materialId, massG: s.massG ?? 1 }
      : { role: 'sample', name: 'test sample', massG: s.massG ?? 1, heatingValueJPerG: s.heatingValueJPerG ?? BA_J_PER_G, smiles: s.smiles ?? 'OC(=O)c1ccccc1' }
    const components: Record<string, unknown>[] = [sample, { role: 'fuse', wire: 'nichrome', lengthCm: 10 }]
    if (s.aidMassG) components.push({ role: 'aid', materialId: s.aidMaterialId ?? aidId, massG: s.aidMassG })
    const r = await call('POST', `/api/plans/${plan.body.id}/runs`, { cookie: analyst, body: { sampleCode: s.sampleCode ?? unique('S'), kind: s.kind ?? 'sample', components } })
    expect(r.status, JSON.stringify(r.body)).toBe(201)
    runs.push({ id: r.body.id, sampleCode: r.body.sampleCode })
  }
  const submitted = await call('POST', `/api/plans/${plan.body.id}/submit`, { cookie: analyst, body: {} })
  expect(submitted.status).toBe(200)
  const status = new Map<string, string>(submitted.body.runs.map((r: { id: string, status: string }) => [r.id, r.status]))
  return runs.map(r => ({ ...r, status: status.get(r.id)! }))
}

export async function readyRuns(vesselId: string, specs: RunSpec[], cookie?: string) {
  const runs = await plannedRuns(vesselId, specs, cookie)
  for (const r of runs) expect(r.status, `${r.sampleCode} should be ready`).toBe('ready')
  return runs
}

export async function fire(runId: string, body: Record<string, unknown> = {}, opts: { key?: string | null, cookie?: string } = {}) {
  const headers: Record<string, string> = {}
  if (opts.key !== null) headers['Idempotency-Key'] = opts.key ?? randomUUID()
  return call('POST', `/api/runs/${runId}/firing`, { cookie: opts.cookie ?? await as('analyst'), headers, body: { outcome: 'complete', weighedMassG: 1, ...body } })
}

export async function enterResult(runId: string, body: Record<string, unknown>, cookie?: string) {
  return call('POST', `/api/runs/${runId}/result`, { cookie: cookie ?? await as('analyst'), body })
}

/**
 * A vessel with an accepted energy equivalent: five benzoic-acid standardisation runs (1.0000 g, 10 cm fuse, no acid)
 * whose θ gives exactly the ε listed (θ = (m·q + e_fuse)/ε, ASTM D240 §8), accepted by the supervisor.
 */
export async function standardisedVessel(epsilons = [10_000, 10_005, 9_995, 10_002, 9_998], over: Record<string, unknown> = {}) {
  const v = await registerVessel(over)
  const ba = await benzoicAcidId()
  const runs = await readyRuns(v.id, epsilons.map((_, i) => ({ sampleCode: unique(`STD${i}`), kind: 'standardisation' as const, materialId: ba, massG: 1 })))
  const resultIds: string[] = []
  for (const [i, r] of runs.entries()) {
    expect((await fire(r.id, { weighedMassG: 1 })).status).toBe(201)
    const res = await enterResult(r.id, { temperatureRiseK: (BA_J_PER_G + FUSE_10CM_J) / epsilons[i]!, fuse: { wire: 'nichrome', burntLengthCm: 10 } })
    expect(res.status, JSON.stringify(res.body)).toBe(201)
    resultIds.push(res.body.result.id)
  }
  const accepted = await call('POST', `/api/vessels/${v.id}/energy-equivalent`, { cookie: await as('supervisor'), body: { resultIds, password: PASSWORD, reason: 'series within the limits' } })
  expect(accepted.status, JSON.stringify(accepted.body)).toBe(201)
  return { vessel: v, resultIds, energyEquivalent: accepted.body.energyEquivalent as { id: string, valueJPerK: number, standardDeviationJPerK: number, runs: number } }
}
