// Security headers on every answer. nuxt-security (nuxt.config.ts → security) sends the CSP with a fresh
// nonce, Permissions-Policy and Cross-Origin-Opener-Policy only with rendered pages; this plugin sends them with
// API answers, downloads and assets too (a strict CSP: nothing in a JSON answer may run or be framed), and sends
// HSTS only when the request came over HTTPS — a browser must ignore it over plain HTTP anyway (RFC 6797 §8.1).
import type { H3Event } from 'h3'

// Answers that are not pages never need to load anything; a page's own CSP replaces this one when it is rendered.
const NON_PAGE_CSP = 'default-src \'none\'; frame-ancestors \'none\'; base-uri \'none\'; form-action \'none\''
const HSTS = 'max-age=31536000; includeSubDomains'

type PolicyValue = string[] | string | false
interface SecurityHeaders { permissionsPolicy?: Record<string, PolicyValue> | false, crossOriginOpenerPolicy?: string | false, crossOriginResourcePolicy?: string | false }

/** Permissions-Policy as nuxt-security writes it from the same settings (`camera=()`), so pages and the rest agree. */
function permissionsPolicy(p: Record<string, PolicyValue>): string {
  return Object.entries(p).filter(([, v]) => v !== false).map(([k, v]) => (typeof v === 'string' ? `${k}=${v}` : `${k}=(${(v as string[]).join(' ')})`)).join(', ')
}

/** The request reached us over TLS, directly or through a proxy that says so. */
function overHttps(event: H3Event): boolean {
  if ((event.node.req.socket as { encrypted?: boolean } | undefined)?.encrypted) return true
  return getRequestHeader(event, 'x-forwarded-proto')?.split(',')[0]?.trim().toLowerCase() === 'https'
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
  })
  // A route may send its own CSP (attachments are sandboxed); framing stays forbidden whatever it says.
  nitroApp.hooks.hook('beforeResponse', (event) => {
    const csp = getResponseHeader(event, 'content-security-policy')
    if (typeof csp === 'string' && !/frame-ancestors/i.test(csp)) setResponseHeader(event, 'Content-Security-Policy', `${csp.replace(/;\s*$/, '')}; frame-ancestors 'none'`)
  })
})
