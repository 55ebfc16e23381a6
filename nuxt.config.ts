// Nuxt configuration: one app, its server routes and the shared engine.
import { join } from 'node:path'
import { fileURLToPath } from 'node:url'
import { bundleWorker } from './server/workers/bundle'

export default defineNuxtConfig({
  modules: ['@pinia/nuxt', '@nuxtjs/tailwindcss', 'nuxt-auth-utils'],
  // components are named by their file name, whatever feature folder holds them
  components: [{ path: '~/components', pathPrefix: false, extensions: ['.vue'] }],
  devtools: { enabled: false },
  app: {
    head: {
      title: 'Stratavolt',
      htmlAttrs: { lang: 'en' },
      link: [{ rel: 'icon', type: 'image/svg+xml', href: '/favicon.svg' }],
      meta: [{ name: 'viewport', content: 'width=device-width, initial-scale=1' }],
    },
  },
  css: ['~/assets/css/tailwind.css'],
  runtimeConfig: {
    databaseUrl: '',
    mailboxDir: '',
    smtpHost: '127.0.0.1',
    smtpPort: 2525,
    smtpUser: '',
    smtpPass: '',
    mailFrom: 'Stratavolt <no-reply@stratavolt.local>',
    appUrl: 'http://127.0.0.1:3000',
    purchasingEmail: 'purchasing@example.com',
    // demo accounts, designs and catalogue: only `npm start` in demo mode sets NUXT_SEED_DEMO=true
    seedDemo: false,
    // without the demo: the first administrator's e-mail (NUXT_ADMIN_EMAIL), invited when no account exists
    adminEmail: '',
    // session cookie `Secure` flag: '' follows the deployment (on when appUrl is https or the request
    // came over TLS), 'true' / 'false' force it (NUXT_COOKIE_SECURE)
    cookieSecure: '',
    uploadDir: '',
    s3Bucket: '',
    s3Endpoint: '',
    s3Region: 'auto',
    s3AccessKeyId: '',
    s3SecretAccessKey: '',
    session: { maxAge: 60 * 60 * 12, cookie: { sameSite: 'lax' } },
    public: {
      // the company default locale for dates, numbers and money (NUXT_PUBLIC_LOCALE): en-GB, de-DE, sv-SE or en-US
      locale: 'en-GB',
    },
  },
  compatibilityDate: '2026-11-01',
  nitro: {
    // `npm test` builds into .output-test (scripts/lib.mjs ensureBuild) so it never replaces the
    // build a running `npm start` serves
    output: { dir: process.env.STRATAVOLT_OUTPUT_DIR || '.output' },
    // gzip and brotli copies of the static files, made once at build time
    compressPublicAssets: true,
    serverAssets: [
      { baseName: 'migrations', dir: '../drizzle' },
      // pdfmake's full Roboto TTFs for server-made PDFs (the web UI uses @fontsource/roboto)
      { baseName: 'fonts', dir: '../node_modules/pdfmake/fonts/Roboto' },
    ],
  },
  typescript: { strict: true },
  telemetry: false,
  hooks: {
    // Our database error mapping (server/error.ts) runs first, then Nuxt's own error handler renders.
    'nitro:config'(config) {
      const nuxtHandler = config.errorHandler
      config.errorHandler = [fileURLToPath(new URL('./server/error.ts', import.meta.url)), ...(Array.isArray(nuxtHandler) ? nuxtHandler : nuxtHandler ? [nuxtHandler] : [])]
    },
    // The worker threads' file (server/workers/engine.ts) is bundled beside the server: workers/engine.mjs.
    'nitro:init'(nitro) {
      if (nitro.options.dev) nitro.hooks.hook('dev:reload', () => bundleWorker(join(nitro.options.buildDir, 'dev')))
      else nitro.hooks.hook('compiled', () => bundleWorker(nitro.options.output.serverDir))
    },
  },
})
