import { describe, expect, it } from 'vitest'
import { as, call } from '../support/api'
import type { DemoRole } from '../support/api'
import { apiRoutes } from '../support/routes'

// Who may call what: the single source of truth for the server's role checks (DESIGN.md §1).
// 'public' = no session needed; 'all' = any signed-in role. Every route file must appear here.
type Who = 'public' | 'all' | ('analyst' | 'supervisor' | 'technician' | 'admin')[]
const MATRIX: Record<string, Who> = {
  'POST /api/auth/login': 'public',
  'GET /api/health': 'public',
  'POST /api/auth/logout': 'all',
  'GET /api/settings': 'all',
  'PATCH /api/settings': ['supervisor', 'admin'],
  'GET /api/fleet': 'all',
  'POST /api/assess': 'all',
  'GET /api/attachments/[id]': 'all',
  'GET /api/admin/mail': ['admin'],
  'POST /api/admin/reminders/run': ['admin'],
  'GET /api/admin/users': ['admin'],
  'POST /api/admin/users': ['admin'],
  'PATCH /api/admin/users/[id]': ['admin'],
  'POST /api/admin/users/[id]/password': ['admin'],
  'POST /api/admin/users/[id]/sign-out': ['admin'],
  'GET /api/approvals': ['supervisor'],
  'GET /api/audit': ['supervisor', 'admin'],
  'GET /api/audit/export.csv': ['supervisor', 'admin'],
  'GET /api/audit/facets': ['supervisor', 'admin'],
  'GET /api/materials': 'all',
  'POST /api/materials': ['supervisor'],
  'GET /api/materials/[id]': 'all',
  'PATCH /api/materials/[id]': ['supervisor'],
  'GET /api/plans': ['analyst', 'supervisor'],
  'POST /api/plans': ['analyst'],
  'GET /api/plans/[id]': ['analyst', 'supervisor'],
  'POST /api/plans/[id]/import': ['analyst'],
  'POST /api/plans/[id]/runs': ['analyst'],
  'POST /api/plans/[id]/submit': ['analyst'],
  'GET /api/plans/import-template.csv': ['analyst', 'supervisor'],
  'GET /api/runs/[id]': ['analyst', 'supervisor'],
  'PATCH /api/runs/[id]': ['analyst'],
  'POST /api/runs/[id]/approve': ['supervisor'],
  'POST /api/runs/[id]/reject': ['supervisor'],
  'POST /api/runs/[id]/duplicate': ['analyst'],
  'POST /api/runs/[id]/withdraw': ['analyst'],
  'POST /api/runs/[id]/firing': ['analyst'],
  'POST /api/runs/[id]/result': ['analyst'],
  'GET /api/results': ['analyst', 'supervisor'],
  'GET /api/results/bench': ['analyst', 'supervisor'],
  'GET /api/results/export.csv': ['analyst', 'supervisor'],
  'GET /api/results/thermogram-template.csv': ['analyst', 'supervisor'],
  'GET /api/results/[id]': ['analyst', 'supervisor'],
  'POST /api/results/[id]/revise': ['analyst', 'supervisor'],
  'POST /api/results/[id]/sign': ['supervisor'],
  'GET /api/reports': ['analyst', 'supervisor'],
  'POST /api/reports': ['supervisor'],
  'GET /api/reports/[id]/certificate.pdf': ['analyst', 'supervisor'],
  'GET /api/standardisation': ['analyst', 'supervisor'],
  'GET /api/standardisation/[vesselId]': 'all',
  'GET /api/vessels': 'all',
  'POST /api/vessels': ['admin'],
  'GET /api/vessels/[id]': 'all',
  'PATCH /api/vessels/[id]': ['admin'],
  'POST /api/vessels/[id]/attachments': ['technician'],
  'GET /api/vessels/[id]/energy-equivalent': 'all',
  'POST /api/vessels/[id]/energy-equivalent': ['supervisor'],
  'GET /api/vessels/[id]/firings': 'all',
  'GET /api/vessels/[id]/services': 'all',
  'POST /api/vessels/[id]/services': ['technician'],
}

const ROLES: DemoRole[] = ['analyst', 'supervisor', 'technician', 'admin']
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
