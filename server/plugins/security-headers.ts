// Security headers on every answer. nuxt-security (nuxt.config.ts → security) sends the CSP with a fresh
// nonce, Permissions-Policy and Cross-Origin-Opener-Policy only with rendered pages; this plugin sends them with
// API answers, downloads and assets too (a strict CSP: nothing in a JSON answer may run or be framed), and sends
// HSTS only when the request came over TLS, here or at a proxy the admin trusts (EMBERLINE_TRUST_PROXY=1) — a
// client's own X-Forwarded-Proto is not believed. Cache-Control: no-store on every API answer and page.
// Answers that are not pages never need to load anything; a page's own CSP replaces this one when it is rendered.
const NON_PAGE_CSP = 'default-src \'none\'; frame-ancestors \'none\'; base-uri \'none\'; form-action \'none\''
const HSTS = 'max-age=31536000; includeSubDomains'

type PolicyValue = string[] | string | false
interface SecurityHeaders { permissionsPolicy?: Record<string, PolicyValue> | false, crossOriginOpenerPolicy?: string | false, crossOriginResourcePolicy?: string | false }

/** Permissions-Policy as nuxt-security writes it from the same settings (`camera=()`), so pages and the rest agree. */
function permissionsPolicy(p: Record<string, PolicyValue>): string {
  return Object.entries(p).filter(([, v]) => v !== false).map(([k, v]) => (typeof v === 'string' ? `${k}=${v}` : `${k}=(${(v as string[]).join(' ')})`)).join(', ')
}

export default defineNitroPlugin((nitroApp) => {
  const settings = (useRuntimeConfig().security as { headers?: SecurityHeaders } | undefined)?.headers ?? {}
  const always: Record<string, string> = {
    'Content-Security-Policy': NON_PAGE_CSP,
    'X-Content-Type-Options': 'nosniff',
    'Referrer-Policy': 'same-origin',
    'X-Frame-Options': 'DENY',
  }
  if (settings.permissionsPolicy) always['Permissions-Policy'] = permissionsPolicy(settings.permissionsPolicy)
  if (settings.crossOriginOpenerPolicy) always['Cross-Origin-Opener-Policy'] = settings.crossOriginOpenerPolicy
  if (settings.crossOriginResourcePolicy) always['Cross-Origin-Resource-Policy'] = settings.crossOriginResourcePolicy

  // Runs before any handler, so that errors, redirects and static files carry the headers too.
  nitroApp.hooks.hook('request', (event) => {
    setResponseHeaders(event, always)
    if (overHttps(event)) setResponseHeader(event, 'Strict-Transport-Security', HSTS)
    // Answers that depend on who asks (every API answer and every rendered page) are never stored by a browser or a
    // proxy; built assets keep Nitro's long caching.
    const path = event.path.split('?')[0] ?? ''
    if (path.startsWith('/api/') || (!path.startsWith('/_nuxt/') && !/\.[a-z0-9]{2,5}$/i.test(path))) setResponseHeader(event, 'Cache-Control', 'no-store')
  })
  // A route may send its own CSP (attachments are sandboxed); framing stays forbidden whatever it says.
  nitroApp.hooks.hook('beforeResponse', (event) => {
    const csp = getResponseHeader(event, 'content-security-policy')
    if (typeof csp === 'string' && !/frame-ancestors/i.test(csp)) setResponseHeader(event, 'Content-Security-Policy', `${csp.replace(/;\s*$/, '')}; frame-ancestors 'none'`)
  })
})
