import { describe, expect, it } from 'vitest'
import { call } from '../support/api'
import { apiRoutes } from '../support/routes'

// Routes anyone may call without a session; every other route must answer 401 before looking at its input.
const PUBLIC = new Set(['POST /api/auth/login', 'GET /api/health'])

describe('every API route needs a session', () => {
  const routes = apiRoutes()
  it('finds the route files', () => {
    expect(routes.length).toBeGreaterThan(5)
  })
  for (const r of routes.filter(r => !PUBLIC.has(r.key))) {
    it(`${r.key} answers 401 without a session`, async () => {
      const res = await call(r.method, r.path, r.method === 'GET' ? {} : { body: { anything: 'at all' } })
      expect(res.status).toBe(401)
      expect(res.body.message).toBeTruthy()
    })
  }
})
