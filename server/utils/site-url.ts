/**
 * An absolute link into Emberline for e-mails (a mail client cannot follow `/vessels/…`), from the configured
 * public address `runtimeConfig.public.siteUrl` (NUXT_PUBLIC_SITE_URL; http://localhost:3000 when unset).
 */
export function siteLink(path: string): string {
  const base = String(useRuntimeConfig().public.siteUrl || 'http://localhost:3000').replace(/\/+$/, '')
  return `${base}${path.startsWith('/') ? path : `/${path}`}`
}
