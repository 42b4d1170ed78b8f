// Requests for a Host other than the configured public origin (NUXT_PUBLIC_SITE_URL) are refused with 421: links in
// mail, redirects and the cross-site check never take a client's word for this server's own name.
// A health probe may name the server by its address (load balancers, monitoring): it reveals nothing.
const HEALTH = '/api/health'

export default defineEventHandler((event) => {
  if ((event.method === 'GET' || event.method === 'HEAD') && event.path.split('?')[0] === HEALTH) return
  // A request this server makes to itself (server-side rendering, error pages) is not a client's.
  if ('__unenv__' in event.node.req) return
  const site = siteOrigins()
  const scheme = new URL(site.origin).protocol.replace(':', '')
  const host = requestedHost(event, scheme)
  if (host && site.hosts.has(host)) return
  throw createError({
    statusCode: 421,
    message: `This server answers for ${site.origin} only (NUXT_PUBLIC_SITE_URL); the request named ${host ? `the host ${host.slice(0, 200)}` : 'no host'}.`,
  })
})
