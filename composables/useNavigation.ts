import type { Role } from '#shared/types/roles'

// Navigation in the lab's words, by role.
export interface NavItem { label: string, to: string, roles: Role[] | 'all', match?: string }

export const NAV_ITEMS: NavItem[] = [
  { label: 'Today', to: '/', roles: 'all' },
  { label: 'Quick check', to: '/check', roles: 'all' },
  { label: 'Plans', to: '/plans', roles: ['analyst', 'supervisor'] },
  { label: 'Approvals', to: '/approvals', roles: ['supervisor'] },
  { label: 'Bench', to: '/bench', roles: ['analyst', 'supervisor'] },
  { label: 'Standardisation', to: '/standardisation', roles: ['analyst', 'supervisor'] },
  { label: 'Vessels', to: '/vessels', roles: 'all' },
  { label: 'Materials', to: '/materials', roles: 'all' },
  { label: 'Audit', to: '/audit', roles: ['supervisor', 'admin'] },
  // Supervisors own the lab policy without being admins.
  { label: 'Lab policy', to: '/admin/policy', roles: ['supervisor'] },
  { label: 'Admin', to: '/admin/users', roles: ['admin'], match: '/admin' },
]

export function useNavigation() {
  const { user } = useUserSession()
  return computed(() => NAV_ITEMS.filter(i => i.roles === 'all' || i.roles.some(r => user.value?.roles.includes(r))))
}

/** True when the signed-in user holds any of the roles (interface only; the server decides). */
export function useHasRole() {
  const { user } = useUserSession()
  return (...roles: Role[]) => roles.some(r => user.value?.roles.includes(r))
}
