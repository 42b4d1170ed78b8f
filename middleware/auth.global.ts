import { allows, pageAccess } from '#shared/access'
import type { Role } from '#shared/types/roles'

// Interface guard only: pages follow the access map in shared/access.ts. The server checks every request itself.
export default defineNuxtRouteMiddleware(async (to) => {
  const { loggedIn, user } = useUserSession()
  const who = pageAccess(to.path)
  if (who === 'public') return
  if (!loggedIn.value) return navigateTo({ path: '/login', query: to.fullPath !== '/' ? { next: to.fullPath } : {} })
  // A page may still name roles in definePageMeta; then both the map and the page must allow.
  const pageRoles = to.meta.roles as Role[] | undefined
  // Said, not hidden: a page the role cannot use explains which role it needs (the URL asked for is kept in `from`).
  if (!allows(who, user.value?.roles) || (pageRoles && !allows(pageRoles, user.value?.roles))) return navigateTo({ path: '/forbidden', query: { from: to.fullPath } })
})
