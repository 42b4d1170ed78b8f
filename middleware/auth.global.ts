import type { Role } from '#shared/types/roles'

// Interface guard only: every page but sign-in needs a session. The server checks every request itself.
export default defineNuxtRouteMiddleware(async (to) => {
  const { loggedIn } = useUserSession()
  if (to.path === '/login') return
  if (!loggedIn.value) return navigateTo({ path: '/login', query: to.fullPath !== '/' ? { next: to.fullPath } : {} })
  const roles = to.meta.roles as Role[] | undefined
  const { user } = useUserSession()
  // Said, not hidden: a page the role cannot use explains which role it needs (the URL asked for is kept in `from`).
  if (roles && !roles.some(r => user.value?.roles.includes(r))) return navigateTo({ path: '/forbidden', query: { from: to.fullPath } })
})
