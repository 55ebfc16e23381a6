// Security headers on every response; origin check and body size limit on state-changing requests.
const BODY_LIMIT_BYTES = 1024 * 1024
const UPLOAD_LIMIT_BYTES = 12 * 1024 * 1024

export default defineEventHandler((event) => {
  setResponseHeaders(event, {
    'X-Content-Type-Options': 'nosniff',
    'X-Frame-Options': 'DENY',
    'Referrer-Policy': 'same-origin',
    'Permissions-Policy': 'camera=(), microphone=(), geolocation=()',
    'Cross-Origin-Opener-Policy': 'same-origin',
    ...(import.meta.dev
      ? {}
      : { 'Content-Security-Policy': 'default-src \'self\'; script-src \'self\' \'unsafe-inline\'; style-src \'self\' \'unsafe-inline\'; img-src \'self\' data: blob:; font-src \'self\' data:; connect-src \'self\'; object-src \'none\'; frame-ancestors \'none\'; base-uri \'self\'; form-action \'self\'' }),
  })
  const method = event.method
  if (method === 'GET' || method === 'HEAD' || method === 'OPTIONS') return

  const origin = getHeader(event, 'origin')
  if (origin && origin !== 'null') {
    const host = getRequestHost(event, { xForwardedHost: false })
    let originHost = ''
    try { originHost = new URL(origin).host }
    catch { /* unparsable origin is refused below */ }
    if (originHost !== host) throw createError({ statusCode: 403, message: 'Cross-site request refused.' })
  }
  const length = Number(getHeader(event, 'content-length') ?? 0)
  const limit = event.path.startsWith('/api/catalog/imports') ? UPLOAD_LIMIT_BYTES : BODY_LIMIT_BYTES
  if (length > limit) throw createError({ statusCode: 413, message: `The request body is larger than ${Math.round(limit / 1024 / 1024)} MB.` })
})
