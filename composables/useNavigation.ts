import type { Role } from '#shared/types/roles'

// Navigation in the lab's words, by role (DESIGN.md §7).
export interface NavItem { label: string, to: string, roles: Role[] | 'all' }

export const NAV_ITEMS: NavItem[] = [
  { label: 'Today', to: '/', roles: 'all' },
  { label: 'Vessels', to: '/vessels', roles: 'all' },
  { label: 'Audit', to: '/audit', roles: ['supervisor', 'admin'] },
  { label: 'Admin', to: '/admin/users', roles: ['admin'] },
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
