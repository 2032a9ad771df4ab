import { fileURLToPath } from 'node:url'
import { join } from 'node:path'
import { PDF_REWRITE_WORKER } from './server/pdf-rewrite/task'
import { buildRewriteWorker } from './server/pdf-rewrite/build-worker'

// Nuxt 4 with the root-level layout: pages/, components/, server/, shared/ sit at the top.
export default defineNuxtConfig({
  compatibilityDate: '2026-06-01',
  modules: ['@nuxtjs/tailwindcss', '@pinia/nuxt', 'nuxt-auth-utils'],
  devtools: { enabled: false },
  telemetry: false,
  css: [
    '@fontsource/inter/400.css',
    '@fontsource/inter/500.css',
    '@fontsource/inter/600.css',
    '@fontsource/inter/700.css',
    '@fontsource/merriweather/400.css',
    '@fontsource/merriweather/700.css',
    '@fontsource/merriweather/400-italic.css',
    'katex/dist/katex.min.css',
    '~/assets/css/report.css',
  ],
  tailwindcss: { cssPath: '~/assets/css/tailwind.css', viewer: false },
  app: {
    head: {
      htmlAttrs: { lang: 'en-GB' },
      title: 'Tendonbook',
      meta: [{ name: 'viewport', content: 'width=device-width, initial-scale=1' }],
      link: [{ rel: 'icon', type: 'image/svg+xml', href: '/favicon.svg' }],
    },
  },
  runtimeConfig: {
    // NUXT_SESSION_PASSWORD is provided by scripts/start.mjs and scripts/test.mjs (kept in .data/)
    session: {
      name: 'tendonbook-session',
      maxAge: 60 * 60 * 8,
      cookie: { sameSite: 'lax' },
    },
    database: {
      host: '127.0.0.1',
      port: 3406,
      user: 'tendonbook',
      password: '',
      name: 'tendonbook',
      // "host:port,host:port…" (NUXT_DATABASE_HOSTS): several servers, e.g. Galera nodes, preferred first
      hosts: '',
    },
    mail: {
      host: '127.0.0.1',
      port: 2526,
      user: '',
      password: '',
      secure: false,
      from: 'Tendonbook <no-reply@tendonbook.local>',
    },
    // driver 'fs' (base folder) locally; 's3' in production with the settings below (NUXT_STORAGE_*)
    storage: { driver: 'fs', base: '.data/files', endpoint: '', bucket: '', region: '', accessKeyId: '', secretAccessKey: '' },
    chromiumPath: '/usr/bin/chromium',
    // the Ed25519 key that signs the history log's tree heads, outside the database (NUXT_LOG_SIGNING_KEY_PATH)
    log: { signingKeyPath: '' },
    mailboxDir: '',
    public: {
      devMailbox: false,
      // how dates read on screen (NUXT_PUBLIC_OFFICE_LOCALE); records keep ISO 8601
      officeLocale: 'en-GB',
    },
  },
  // the print page is static HTML and CSS that Chromium prints with scripts off: no scripts, no
  // resource hints, and no data payload (which repeated the whole report a second time)
  routeRules: {
    '/revisions/*/print': { noScripts: true },
    // the address people type for a sign-in page
    '/login': { redirect: { to: '/signin', statusCode: 301 } },
  },
  nitro: {
    experimental: { tasks: true },
    imports: { dirs: ['./server/services'] },
  },
  hooks: {
    // security: errors nobody answered for are put into words before Nuxt's own handler renders them
    'nitro:config'(config) {
      config.errorHandler = [fileURLToPath(new URL('./server/error-words.ts', import.meta.url)), ...[config.errorHandler ?? []].flat()]
    },
    // the PDF rewrite's worker thread (server/utils/pdf.ts) is its own file beside the built server,
    // bundled with pdf-lib so that it needs nothing else
    'nitro:build:before'(nitro) {
      if (nitro.options.dev) return
      nitro.hooks.hook('compiled', () => buildRewriteWorker(join(nitro.options.output.serverDir, PDF_REWRITE_WORKER)))
    },
  },
  typescript: { strict: true },
  vite: {
    optimizeDeps: { include: ['markdown-it', 'katex', 'yaml', 'd3-scale', 'd3-shape', 'zod', 'papaparse'] },
  },
})
