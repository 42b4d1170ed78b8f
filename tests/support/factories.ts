// Small factories over the real API: vessels, plans and runs made the way a lab would make them.
import { expect } from 'vitest'
import { as, call, unique } from './api'

export async function demoVessel(name: string) {
  const res = await call('GET', '/api/vessels', { cookie: await as('analyst') })
  const v = res.body.find((x: { name: string }) => x.name.startsWith(name))
  if (!v) throw new Error(`demo vessel ${name} missing`)
  return v
}

export async function material(namePrefix: string) {
  const res = await call('GET', `/api/materials?q=${encodeURIComponent(namePrefix)}&limit=50&derived=0`, { cookie: await as('analyst') })
  const m = res.body.rows.find((x: { name: string }) => x.name.startsWith(namePrefix))
  if (!m) throw new Error(`material ${namePrefix} missing`)
  return m
}

export async function newVessel(over: Record<string, unknown> = {}) {
  const res = await call('POST', '/api/vessels', {
    cookie: await as('admin'),
    body: { name: unique('T'), serialNumber: unique('SN'), class: 'standard', ratedEnergyJ: 33000, maxChargeMassG: 1.5, maxFillPressureMPa: 4.05, volumeMl: 300, ...over },
  })
  expect(res.status).toBe(201)
  return res.body
}

export async function newPlan(vesselId: string, cookie?: string) {
  const res = await call('POST', '/api/plans', { cookie: cookie ?? await as('analyst'), body: { name: unique('Plan'), vesselId, fillPressureMPa: 3.0 } })
  expect(res.status).toBe(201)
  return res.body
}

/** Benzoic acid by structure: a sample whose identity the screen can clear (no group of UN Appendix 6, Table A6.1). */
export const BENZOIC_ACID_SMILES = 'OC(=O)c1ccccc1'

/** A sample run: `massG` of a sample with a declared heating value and a known structure, fired on 10 cm of Ni-Cr wire. */
export function sampleRun(massG: number, heatingValueJPerG = 26454, extra: Record<string, unknown> = {}) {
  return { sampleCode: unique('S'), components: [{ role: 'sample', massG, heatingValueJPerG, smiles: BENZOIC_ACID_SMILES }, { role: 'fuse', wire: 'nichrome', lengthCm: 10 }], ...extra }
}

export async function addRun(planId: string, body: Record<string, unknown>, cookie?: string) {
  return call('POST', `/api/plans/${planId}/runs`, { cookie: cookie ?? await as('analyst'), body })
}

/** The library's certified benzoic acid: the reference standard that standardisation and check runs burn. */
export async function benzoicAcidMaterialId(): Promise<string> {
  return (await material('Benzoic acid, calorimetric standard')).id
}

/** A fresh user made by the admin, with a password strong enough for the server's rule. */
export async function newUser(roles: string[] = ['analyst'], password = 'quartz lantern meadow', name = 'Test Person') {
  const email = `${unique('u')}@emberline.test`
  const res = await call('POST', '/api/admin/users', { cookie: await as('admin'), body: { email, name, roles, password } })
  expect(res.status).toBe(201)
  return { id: res.body.id as string, email, password }
}
