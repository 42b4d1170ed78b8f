import { describe, expect, it } from 'vitest'
import { as, call } from '../support/api'

// Every 422 names the field in the product's words; zod's defaults never reach a person.
describe('validation messages in the product\'s words', () => {
  it('answers sign-in with an empty password "Password: required"', async () => {
    const res = await call('POST', '/api/auth/login', { body: { email: 'analyst@emberline.test', password: '' } })
    expect(res.status).toBe(422)
    expect(res.body.data.fields).toEqual([{ path: 'password', message: 'required' }])
    expect(res.body.message).toBe('Please correct this field — Password: required')
    expect(JSON.stringify(res.body)).not.toMatch(/Too small|expected string|>=/)
  })

  it('words a run with a wrong fill and a missing sample code plainly, naming each field', async () => {
    const analyst = await as('analyst')
    const vessels = (await call('GET', '/api/vessels', { cookie: analyst })).body as { id: string }[]
    const plan = await call('POST', '/api/plans', { cookie: analyst, body: { name: `words ${Date.now()}`, vesselId: vessels[0]!.id, fillPressureMPa: 3.0 } })
    const res = await call('POST', `/api/plans/${plan.body.id}/runs`, { cookie: analyst, body: { kind: 'sample', fillPressureMPa: 'three', components: [{ role: 'sample', massG: 1, heatingValueJPerG: 26454 }] } })
    expect(res.status).toBe(422)
    const byPath = Object.fromEntries(res.body.data.fields.map((f: { path: string, message: string }) => [f.path, f.message]))
    expect(byPath.sampleCode).toBe('required')
    expect(byPath.fillPressureMPa).toBe('must be a number')
    expect(res.body.message).toMatch(/^Please correct these fields — .*Sample code: required.*Fill pressure \(MPa gauge\): must be a number/)
  })

  it('serves the page an analyst may not open with a 403 that names the role needed', async () => {
    const res = await fetch(`${(await import('../support/api')).baseURL()}/forbidden?from=/approvals`, { headers: { cookie: await as('analyst') } })
    expect(res.status).toBe(403)
  })
})
