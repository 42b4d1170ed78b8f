// Cross-site request protection, before sign-in checks: a change (POST, PUT, PATCH, DELETE) is refused
// with 403 when the browser says it comes from another site (Sec-Fetch-Site: cross-site) or names an Origin other
// than this server's own. Callers that send neither (scripts, server-to-server, tests) pass: a browser always sends
// Origin on such requests, and the session cookie (SameSite=Lax) is the second line.
const CHANGES = new Set(['POST', 'PUT', 'PATCH', 'DELETE'])

/** The Origin is the configured public origin (or a loopback spelling of it, server/utils/site.ts). */
function sameOrigin(origin: string): boolean {
  if (origin === 'null') return false
  try {
    // URL normalises case and default ports (https://x:443 is https://x).
    return siteOrigins().origins.has(new URL(origin).origin)
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
  else if (origin !== undefined && !sameOrigin(origin)) why = `Origin ${origin.slice(0, 200)}`
  if (why) {
    throw createError({
      statusCode: 403,
      message: 'This request came from another site and was refused: Emberline accepts changes only from its own pages. Nothing was changed.',
      data: { reason: why },
    })
  }
})
