// Every /api route needs a signed-in, active user unless listed as public; 401 comes before any validation.
export default defineEventHandler(async (event) => {
  const path = event.path.split('?')[0] ?? ''
  if (!path.startsWith('/api/')) return
  if (PUBLIC_API_ROUTES.has(`${event.method} ${path}`)) return
  await requireUser(event)
})
