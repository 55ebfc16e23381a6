// Nuxt configuration: one app, its server routes and the shared engine.
export default defineNuxtConfig({
  compatibilityDate: '2026-11-01',
  devtools: { enabled: false },
  telemetry: false,
  modules: ['@pinia/nuxt', '@nuxtjs/tailwindcss', 'nuxt-auth-utils'],
  css: ['~/assets/css/tailwind.css'],
  app: {
    head: {
      title: 'Stratavolt',
      htmlAttrs: { lang: 'en' },
      link: [{ rel: 'icon', type: 'image/svg+xml', href: '/favicon.svg' }],
      meta: [{ name: 'viewport', content: 'width=device-width, initial-scale=1' }],
    },
  },
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
    seedDemo: true,
    session: { maxAge: 60 * 60 * 12, cookie: { sameSite: 'lax' } },
  },
  nitro: {
    serverAssets: [
      { baseName: 'migrations', dir: '../drizzle' },
      { baseName: 'catalog', dir: '../catalog' },
    ],
  },
  typescript: { strict: true },
})
