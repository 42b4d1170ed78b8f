import { describe, expect, it } from 'vitest'
import { as, call } from '../support/api'
import type { DemoRole } from '../support/api'
import { MATRIX } from '../support/roles-matrix'
import { apiRoutes } from '../support/routes'

const ROLES = ['analyst', 'supervisor', 'technician', 'admin'] as const satisfies DemoRole[]
// Calling these as an allowed role would end the shared test sessions; their refusals are still checked.
const SKIP_ALLOWED = new Set(['POST /api/auth/logout'])

describe('route matrix: every route, every role, and no session', () => {
  const routes = apiRoutes()
  it('lists every route file in the matrix, and nothing that does not exist', () => {
    expect(routes.map(r => r.key).filter(k => !(k in MATRIX))).toEqual([])
    expect(Object.keys(MATRIX).filter(k => !routes.some(r => r.key === k))).toEqual([])
  })

  for (const r of routes) {
    const who = MATRIX[r.key]
    if (!who) continue
    it(`${r.key}: ${who === 'public' ? 'public' : who === 'all' ? 'any role' : who.join(', ')}`, async () => {
      const opts = r.method === 'GET' ? {} : { body: {} }
      const anonymous = await call(r.method, r.path, opts)
      if (who === 'public') expect(anonymous.status).not.toBe(401)
      else expect(anonymous.status).toBe(401)
      for (const role of ROLES) {
        const allowed = who === 'public' || who === 'all' || who.includes(role)
        if (allowed && SKIP_ALLOWED.has(r.key)) continue
        const res = await call(r.method, r.path, { ...opts, cookie: await as(role) })
        if (allowed) expect([401, 403], `${role} should reach ${r.key} (got ${res.status})`).not.toContain(res.status)
        else expect(res.status, `${role} must be refused ${r.key}`).toBe(403)
        expect(res.status, `${r.key} as ${role}`).toBeLessThan(500)
      }
    })
  }
})
