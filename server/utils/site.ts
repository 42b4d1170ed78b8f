// The configured public origin (NUXT_PUBLIC_SITE_URL): the only Host this server answers for, and the only Origin
// it accepts changes from. A loopback origin (localhost, 127.0.0.1, [::1]) accepts every loopback spelling of the
// same port, so `npm start` works whichever name the browser uses.
import type { H3Event } from 'h3'

const LOOPBACK = ['localhost', '127.0.0.1', '[::1]']

export const trustProxy = () => process.env.EMBERLINE_TRUST_PROXY === '1'
const first = (v: string | undefined) => v?.split(',')[0]?.trim() || undefined

let cached: { source: string, origins: Set<string>, hosts: Set<string>, origin: string } | undefined

/** The public origin and every origin / host accepted for it. */
export function siteOrigins() {
  const source = String(useRuntimeConfig().public.siteUrl || 'http://localhost:3000')
  if (cached?.source === source) return cached
  const url = new URL(source)
  const origins = new Set([url.origin])
  const hosts = new Set([url.host.toLowerCase()])
  if (LOOPBACK.includes(url.hostname)) {
    for (const name of LOOPBACK) {
      const u = new URL(url.origin)
      u.hostname = name
      origins.add(u.origin)
      hosts.add(u.host.toLowerCase())
    }
  }
  cached = { source, origins, hosts, origin: url.origin }
  return cached
}

/** The host the client asked for: Host, or X-Forwarded-Host behind a trusted proxy. Normalised (default ports dropped). */
export function requestedHost(event: H3Event, scheme: string): string | null {
  const raw = (trustProxy() && first(getRequestHeader(event, 'x-forwarded-host'))) || getRequestHeader(event, 'host')
  if (!raw) return null
  try {
    return new URL(`${scheme}://${raw}`).host.toLowerCase()
  }
  catch {
    return null
  }
}

/** The request arrived over TLS: on this socket, or at the trusted proxy in front (X-Forwarded-Proto). */
export function overHttps(event: H3Event): boolean {
  if ((event.node.req.socket as { encrypted?: boolean } | undefined)?.encrypted) return true
  return trustProxy() && first(getRequestHeader(event, 'x-forwarded-proto'))?.toLowerCase() === 'https'
}
