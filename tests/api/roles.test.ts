import { describe, expect, it } from 'vitest'
import { as, call } from '../support/api'
import type { DemoRole } from '../support/api'
import { apiRoutes } from '../support/routes'

// Every route under /api/admin is for the admin role alone.
describe('admin routes refuse the other roles with 403', () => {
  const adminRoutes = apiRoutes().filter(r => r.key.includes(' /api/admin/'))
  const others: DemoRole[] = ['analyst', 'supervisor', 'technician']
  it('finds the admin routes', () => expect(adminRoutes.length).toBeGreaterThanOrEqual(5))
  for (const r of adminRoutes) {
    for (const role of others) {
      it(`${r.key} → 403 for ${role}`, async () => {
        const res = await call(r.method, r.path, { cookie: await as(role), ...(r.method === 'GET' ? {} : { body: {} }) })
        expect(res.status).toBe(403)
      })
    }
  }
})

describe('lab policy', () => {
  it('is readable by every role and editable by admin and supervisor only, with a reason', async () => {
    for (const role of ['analyst', 'technician', 'supervisor', 'admin'] as const) {
      expect((await call('GET', '/api/settings', { cookie: await as(role) })).status).toBe(200)
    }
    expect((await call('PATCH', '/api/settings', { cookie: await as('analyst'), body: { reason: 'x', policy: {} } })).status).toBe(403)
    expect((await call('PATCH', '/api/settings', { cookie: await as('technician'), body: { reason: 'x', policy: {} } })).status).toBe(403)
    const noReason = await call('PATCH', '/api/settings', { cookie: await as('admin'), body: { policy: { waterMl: 1 } } })
    expect(noReason.status).toBe(422)
    expect(noReason.body.data.fields[0].path).toBe('reason')
  })
})
