// Cross-site request protection, before sign-in checks: a change (POST, PUT, PATCH, DELETE) is refused
// with 403 when the browser says it comes from another site (Sec-Fetch-Site: cross-site) or names an Origin other
// than this server's own. Callers that send neither (scripts, server-to-server, tests) pass: a browser always sends
// Origin on such requests, and the session cookie (SameSite=Lax) is the second line.
import type { H3Event } from 'h3'

const CHANGES = new Set(['POST', 'PUT', 'PATCH', 'DELETE'])

const first = (v: string | undefined) => v?.split(',')[0]?.trim() || undefined

/**
 * This server's origin as the browser sees it: scheme and host of the request, or — only behind a proxy the
 * admin trusts (EMBERLINE_TRUST_PROXY=1) — those the proxy forwards (X-Forwarded-Proto, X-Forwarded-Host).
 */
function ownOrigin(event: H3Event): string | null {
  const trustProxy = process.env.EMBERLINE_TRUST_PROXY === '1'
  const tls = !!(event.node.req.socket as { encrypted?: boolean } | undefined)?.encrypted
  const proto = (trustProxy && first(getRequestHeader(event, 'x-forwarded-proto'))) || (tls ? 'https' : 'http')
  const host = (trustProxy && first(getRequestHeader(event, 'x-forwarded-host'))) || getRequestHeader(event, 'host')
  if (!host) return null
  try {
    return new URL(`${proto.toLowerCase()}://${host}`).origin
  }
  catch {
    return null
  }
}

function sameOrigin(origin: string, own: string | null): boolean {
  if (!own || origin === 'null') return false
  try {
    // URL normalises case and default ports (https://x:443 is https://x).
    return new URL(origin).origin === own
  }
  catch {
    return false
  }
}

export default defineEventHandler((event) => {
  if (!CHANGES.has(event.method)) return
  const site = getRequestHeader(event, 'sec-fetch-site')?.trim().toLowerCase()
  const origin = getRequestHeader(event, 'origin')?.trim()
  let why: string | null = null
  if (site === 'cross-site') why = 'Sec-Fetch-Site: cross-site'
  else if (origin !== undefined && !sameOrigin(origin, ownOrigin(event))) why = `Origin ${origin.slice(0, 200)}`
  if (why) {
    throw createError({
      statusCode: 403,
      message: 'This request came from another site and was refused: Emberline accepts changes only from its own pages. Nothing was changed.',
      data: { reason: why },
    })
  }
})
