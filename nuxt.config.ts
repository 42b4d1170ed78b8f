// Emberline — Nuxt configuration. The project keeps pages/, components/ … at the root.
// EMBERLINE_BUILD_DIR lets a second build (a parallel worktree, a benchmark) live beside the main one.
const buildRoot = process.env.EMBERLINE_BUILD_DIR

export default defineNuxtConfig({
  // Nuxt 4 switches to app/ as soon as such a folder appears; the project's layout is the root.
  srcDir: '.',
  compatibilityDate: '2026-11-01',
  devtools: { enabled: false },
  modules: ['@nuxtjs/tailwindcss', '@pinia/nuxt', '@vueuse/nuxt', 'nuxt-auth-utils', '@nuxt/eslint'],
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
    // OWASP Password Storage Cheat Sheet: scrypt N = 2^17, r = 8, p = 1 (128 MiB per hash).
    hash: { scrypt: { cost: 131072, blockSize: 8, parallelization: 1, maxMemory: 256 * 1024 * 1024 } },
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
    public: { labName: '' },
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
