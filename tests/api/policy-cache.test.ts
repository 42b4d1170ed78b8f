import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { as, baseURL, call } from '../support/api'
import { startServer } from '../support/server-process'
import type { ServerProcess } from '../support/server-process'

// The policy is kept in each process and announced through PostgreSQL NOTIFY when it changes: a change
// made on one instance is in force on the other at once, and two changes at the same moment both land.

let second: ServerProcess
beforeAll(async () => {
  second = await startServer()
})
afterAll(async () => {
  await second?.stop()
})

async function settingsAt(base: string, cookie: string) {
  const res = await fetch(`${base}/api/settings`, { headers: { cookie } })
  expect(res.status).toBe(200)
  return await res.json() as { policy: Record<string, unknown> }
}

describe('lab policy kept in each process', () => {
  it('a change on one instance is in force on the other', async () => {
    const cookie = await as('admin')
    // Both instances have read (and kept) the policy before the change.
    await settingsAt(baseURL(), cookie)
    await settingsAt(second.baseURL, cookie)
    const res = await call('PATCH', '/api/settings', { cookie, body: { policy: { labTemperatureC: 23 }, reason: 'air conditioning set to 23 °C' } })
    expect(res.status).toBe(200)
    expect(res.body.policy.labTemperatureC).toBe(23)
    await expect.poll(async () => (await settingsAt(second.baseURL, cookie)).policy.labTemperatureC, { timeout: 5_000 }).toBe(23)
    expect((await settingsAt(baseURL(), cookie)).policy.labTemperatureC).toBe(23)
    await call('PATCH', '/api/settings', { cookie, body: { policy: { labTemperatureC: 25 }, reason: 'back to the default' } })
  })

  it('two changes sent at once both land (the merge happens under the row lock)', async () => {
    const admin = await as('admin')
    const supervisor = await as('supervisor')
    const [a, b] = await Promise.all([
      call('PATCH', '/api/settings', { cookie: admin, body: { policy: { waterMl: 1.5 }, reason: 'more water for acid recovery' } }),
      call('PATCH', '/api/settings', { cookie: supervisor, body: { policy: { labTemperatureC: 24 }, reason: 'new room reading' } }),
    ])
    expect(a.status).toBe(200)
    expect(b.status).toBe(200)
    const now = await settingsAt(baseURL(), admin)
    expect(now.policy).toMatchObject({ waterMl: 1.5, labTemperatureC: 24 })
    await call('PATCH', '/api/settings', { cookie: admin, body: { policy: { waterMl: 1, labTemperatureC: 25 }, reason: 'back to the defaults' } })
  })
})
