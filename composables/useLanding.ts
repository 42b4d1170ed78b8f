import type { Role } from '#shared/types/roles'

/** The page each role starts its day on. */
export function landingFor(roles: readonly Role[]): string {
  if (roles.length === 1 && roles[0] === 'admin') return '/admin/users'
  return '/'
}
