// Who may open which page and call which route: one map read by the page middleware, the navigation and the
// route-matrix test. 'public' = no session needed; 'all' = any signed-in role. Every route file must appear in
// API_ACCESS (the route-matrix test walks server/api and fails on a missing one); the server reads its roles from here
// (`requireRole(event)` in each route looks up the matched route), which the same test proves by calling every route
// as every role.
import type { Role } from './types/roles'

export type Who = 'public' | 'all' | Role[]

/** Pages by path prefix; the longest matching prefix decides. Pages not listed are open to every signed-in role. */
export const PAGE_ACCESS: Readonly<Record<string, Who>> = {
  '/login': 'public',
  '/': 'all',
  '/check': 'all',
  '/plans': ['analyst', 'supervisor'],
  '/approvals': ['supervisor'],
  '/bench': ['analyst', 'supervisor'],
  '/results': ['analyst', 'supervisor'],
  '/standardisation': ['analyst', 'supervisor'],
  '/vessels': 'all',
  '/materials': 'all',
  '/audit': ['supervisor', 'admin'],
  // Supervisors own the lab policy without being admins; admins administer it.
  '/admin/policy': ['admin', 'supervisor'],
  '/admin/users': ['admin'],
  '/admin/mail': ['admin'],
  '/account': 'all',
  '/forbidden': 'all',
  '/samples': ['analyst', 'supervisor'],
  '/clients': 'all',
  '/day-plan': ['analyst', 'supervisor'],
}

/** Who may open a page path (the longest listed prefix; 'all' when none matches). */
export function pageAccess(path: string): Who {
  let best: string | undefined
  for (const prefix of Object.keys(PAGE_ACCESS)) {
    const hit = prefix === '/' ? path === '/' : path === prefix || path.startsWith(`${prefix}/`)
    if (hit && (!best || prefix.length > best.length)) best = prefix
  }
  return best ? PAGE_ACCESS[best]! : 'all'
}

/** True when someone with these roles (null: not signed in) may go where `who` allows. */
export function allows(who: Who, roles: readonly Role[] | null | undefined): boolean {
  if (who === 'public') return true
  if (!roles) return false
  return who === 'all' || who.some(r => roles.includes(r))
}

/** API routes as "METHOD /api/path" with [param] segments, as the route files are named. */
export const API_ACCESS: Readonly<Record<string, Who>> = {
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
  'GET /api/runs/[id]/result-context': ['analyst', 'supervisor'],
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
  'GET /api/account/sessions': 'all',
  'POST /api/account/sessions/[id]/end': 'all',
  'POST /api/account/sign-out-others': 'all',
  'POST /api/account/password': 'all',
  'GET /api/clients': 'all',
  'POST /api/clients': ['supervisor', 'admin'],
  'GET /api/samples': 'all',
  'POST /api/samples': ['analyst', 'supervisor'],
  'GET /api/samples/[id]': 'all',
  'POST /api/samples/[id]/reject': ['analyst', 'supervisor'],
  'POST /api/samples/[id]/photos': ['analyst', 'supervisor'],
  'POST /api/plans/[id]/from-samples': ['analyst'],
  'GET /api/search': 'all',
  'POST /api/day-plans/proposal': ['analyst', 'supervisor'],
  'POST /api/day-plans': ['analyst'],
  'GET /api/day-plans': 'all',
  'GET /api/samples/[id]/label.svg': 'all',
  'GET /api/aid-values': ['analyst', 'supervisor', 'admin'],
  'POST /api/aid-values': ['supervisor'],
}
