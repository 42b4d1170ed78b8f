import { allows, pageAccess } from '#shared/access'
import type { Role } from '#shared/types/roles'

// Navigation in the lab's words; who sees an item is the page's entry in the access map (shared/access.ts).
export interface NavItem { label: string, to: string, match?: string }

export const NAV_ITEMS: NavItem[] = [
  { label: 'Today', to: '/' },
  { label: 'Quick check', to: '/check' },
  { label: 'Samples', to: '/samples' },
  { label: 'Plans', to: '/plans' },
  { label: 'Approvals', to: '/approvals' },
  { label: 'Bench', to: '/bench' },
  { label: 'Standardisation', to: '/standardisation' },
  { label: 'Vessels', to: '/vessels' },
  { label: 'Materials', to: '/materials' },
  { label: 'Audit', to: '/audit' },
  { label: 'Lab policy', to: '/admin/policy' },
  { label: 'Admin', to: '/admin/users', match: '/admin' },
]

export function useNavigation() {
  const { user } = useUserSession()
  // Admins reach the policy through Admin's tabs; the policy item is the supervisor's way in.
  return computed(() => NAV_ITEMS.filter(i => allows(pageAccess(i.to), user.value?.roles) && !(i.to === '/admin/policy' && user.value?.roles.includes('admin') && !user.value.roles.includes('supervisor'))))
}

/** True when the signed-in user holds any of the roles (interface only; the server decides). */
export function useHasRole() {
  const { user } = useUserSession()
  return (...roles: Role[]) => roles.some(r => user.value?.roles.includes(r))
}
