// Emberline — Nuxt configuration. The project keeps pages/, components/ … at the root.
// EMBERLINE_BUILD_DIR lets a second build (a parallel worktree, a benchmark) live beside the main one.
import { PRODUCTION_SCRYPT } from './server/utils/password-cost'

const buildRoot = process.env.EMBERLINE_BUILD_DIR

export default defineNuxtConfig({
  // Nuxt 4 switches to app/ as soon as such a folder appears; the project's layout is the root.
  srcDir: '.',
  compatibilityDate: '2026-11-01',
  devtools: { enabled: false },
  modules: ['@nuxtjs/tailwindcss', '@pinia/nuxt', '@vueuse/nuxt', 'nuxt-auth-utils', '@nuxt/eslint', 'nuxt-security'],
  css: ['@fontsource-variable/inter/index.css', '~/assets/css/main.css'],
  app: {
    head: {
      htmlAttrs: { lang: 'en-GB' },
      title: 'Emberline',
      meta: [{ name: 'viewport', content: 'width=device-width, initial-scale=1' }],
      link: [{ rel: 'icon', type: 'image/svg+xml', href: '/favicon.svg' }],
    },
  },
  auth: {
    // OWASP Password Storage Cheat Sheet: scrypt N = 2^17, r = 8, p = 1 (128 MiB per hash); the server may lower it
    // for the test database only (server/plugins/password-cost.ts).
    hash: { scrypt: PRODUCTION_SCRYPT },
  },
  runtimeConfig: {
    databaseUrl: '',
    session: {
      name: 'emberline-session',
      password: '',
      cookie: { sameSite: 'lax', httpOnly: true, secure: true },
      maxAge: 60 * 60 * 12,
    },
    smtp: { host: '127.0.0.1', port: 2525, secure: false, user: '', pass: '', from: 'Emberline <no-reply@emberline.test>' },
    storageDir: '',
    // The public origin (NUXT_PUBLIC_SITE_URL): the only Host answered, the only Origin accepted for changes, and the base of links in e-mails.
    public: { labName: '', siteUrl: 'http://localhost:3000' },
  },
  // Security headers. nuxt-security puts a fresh nonce on every script Nuxt renders and sends the page's
  // CSP with it; server/plugins/security-headers.ts adds the headers it sends only with pages (CSP, Permissions-Policy,
  // COOP) to API answers and assets, and HSTS over HTTPS only. Its in-memory parts stay off: they would differ between
  // instances (sign-in throttling lives in the database) or rewrite bodies; server/middleware/00.origin.ts refuses
  // cross-site writes instead of CSRF tokens.
  security: {
    nonce: true,
    // No prerendered pages: every page is rendered per request with its own nonce, so no hashes are needed.
    ssg: false,
    sri: true,
    removeLoggers: false,
    rateLimiter: false,
    xssValidator: false,
    csrf: false,
    // Same origin only: no CORS headers, so a browser never lets another site read an answer.
    corsHandler: false,
    allowedMethodsRestricter: false,
    // Off: it trusts Content-Length and skips multipart types. server/middleware/00.body-limit.ts bounds every body on
    // the stream with per-route ceilings (server/utils/body-limit.ts).
    requestSizeLimiter: false,
    hidePoweredBy: true,
    headers: {
      contentSecurityPolicy: {
        'default-src': ["'none'"],
        // Scripts only with this response's nonce, and what they load ('strict-dynamic'); never inline or eval.
        'script-src': ["'self'", "'strict-dynamic'", "'nonce-{{nonce}}'"],
        'script-src-attr': ["'none'"],
        // Vue's style bindings write style attributes: inline styles are allowed, scripts are not.
        'style-src': ["'self'", "'unsafe-inline'"],
        'img-src': ["'self'", 'data:'],
        'font-src': ["'self'", 'data:'],
        'connect-src': ["'self'"],
        'manifest-src': ["'self'"],
        'form-action': ["'self'"],
        'base-uri': ["'none'"],
        'object-src': ["'none'"],
        'frame-ancestors': ["'none'"],
        // Off: it would send http://localhost and plain-HTTP LAN set-ups to an https:// that is not there.
        'upgrade-insecure-requests': false,
      },
      crossOriginEmbedderPolicy: false,
      crossOriginOpenerPolicy: 'same-origin',
      crossOriginResourcePolicy: 'same-origin',
      originAgentCluster: '?1',
      referrerPolicy: 'same-origin',
      // Sent by server/plugins/security-headers.ts, and only over HTTPS (RFC 6797 §7.2).
      strictTransportSecurity: false,
      xContentTypeOptions: 'nosniff',
      xDNSPrefetchControl: 'off',
      xDownloadOptions: 'noopen',
      xFrameOptions: 'DENY',
      xPermittedCrossDomainPolicies: 'none',
      xXSSProtection: '0',
      permissionsPolicy: {
        'camera': [],
        'microphone': [],
        'geolocation': [],
        'payment': [],
        'usb': [],
        'display-capture': [],
        'fullscreen': [],
      },
    },
  },
  hooks: {
    // Nitro copies the runtime config and looks up an environment variable for every key of it once per request
    // (useRuntimeConfig(event)); nuxt-auth-utils adds 249 keys for OAuth providers the product never uses (sign-in is
    // by password only), two thirds of that work on every request and on every internal fetch of a page.
    'nitro:config'(config) {
      delete (config.runtimeConfig as Record<string, unknown> | undefined)?.oauth
    },
  },
  tailwindcss: { cssPath: false, configPath: 'tailwind.config.ts', viewer: false },
  eslint: { config: { stylistic: false } },
  typescript: { strict: true },
  ...(buildRoot ? { buildDir: `${buildRoot}/.nuxt` } : {}),
  nitro: {
    ...(buildRoot ? { output: { dir: `${buildRoot}/.output` } } : {}),
    // Photos and certificates of servicing records, read through useStorage('uploads') (server/utils/uploads.ts).
    // Default: the filesystem under .data/uploads (git-ignored), relative to the folder the server starts in;
    // EMBERLINE_UPLOAD_DIR moves it, at build or at start. For an S3-compatible store: add the aws4fetch package
    // (unstorage's s3 driver needs it) and, in a server plugin, unmount 'uploads' and mount unstorage/drivers/s3 with
    // bucket, endpoint, region and keys read from process.env at start (this entry is written into the build, so
    // keys never go here); leave EMBERLINE_UPLOAD_DIR unset, as it always means the filesystem.
    storage: {
      uploads: { driver: 'fs', base: process.env.EMBERLINE_UPLOAD_DIR || './.data/uploads' },
    },
  },
})
