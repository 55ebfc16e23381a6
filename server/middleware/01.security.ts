// Security headers on every response; on state-changing requests the origin check (CSRF) and the
// content-type rule; a path that is not valid percent-encoding is refused before any route sees it.
// The body itself is read, counted and capped in 02.body-limit.ts.
import type { H3Event } from 'h3'

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS'])

/**
 * CSRF rule: a cookie-authenticated state change must come from our own pages. Browsers send
 * `Origin` on every POST/PUT/PATCH/DELETE made by fetch or a form; it must name this host.
 * `Origin: null` (sandboxed frames, some redirects) and foreign origins are refused. Without
 * `Origin`, `Sec-Fetch-Site: same-origin` is accepted; with neither, the request is refused too,
 * so non-browser clients either send `Origin` or use a Bearer token on /api/v1.
 * Bearer-token calls on /api/v1 are exempt: a token is never sent by a browser on its own, so a
 * foreign page cannot ride on it (and no CORS headers let it set Authorization).
 */
function checkOrigin(event: H3Event) {
  const auth = getHeader(event, 'authorization')
  if (auth?.startsWith('Bearer ') && event.path.startsWith('/api/v1/')) return
  const origin = getHeader(event, 'origin')
  if (origin !== undefined) {
    const host = getRequestHost(event, { xForwardedHost: false })
    let originHost: string | null = null
    try { originHost = origin === 'null' ? null : new URL(origin).host }
    catch { /* an unparsable origin is refused below */ }
    if (originHost !== host) throw createError({ statusCode: 403, message: 'Cross-site request refused: this request did not come from a Stratavolt page.' })
    return
  }
  const site = getHeader(event, 'sec-fetch-site')
  if (site === 'same-origin') return
  throw createError({ statusCode: 403, message: 'Cross-site request refused: send an Origin header naming this server, or use an API token on /api/v1.' })
}

/** JSON routes take only JSON; form-encoded and text/plain bodies (what a foreign HTML form can send) get 415. */
function checkContentType(event: H3Event) {
  const length = getHeader(event, 'content-length')
  const chunked = /\bchunked\b/i.test(getHeader(event, 'transfer-encoding') ?? '')
  if (!chunked && (length === undefined || Number(length) === 0)) return // no body
  const type = (getHeader(event, 'content-type') ?? '').split(';')[0]!.trim().toLowerCase()
  if (type === 'application/json') return
  if (type === 'multipart/form-data' && isUploadRoute(event.path)) return
  throw createError({
    statusCode: 415,
    message: isUploadRoute(event.path) ? 'Send the file as multipart/form-data.' : 'Send the request body as JSON (Content-Type: application/json).',
  })
}

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
  // A lone `%` or a broken escape in the path would make route-parameter decoding throw (a 500).
  const pathname = event.path.split('?')[0]!
  try { decodeURIComponent(pathname) }
  catch { throw createError({ statusCode: 400, message: 'The address is not valid: a "%" must start an escape such as %25.' }) }

  if (SAFE_METHODS.has(event.method)) return
  checkOrigin(event)
  checkContentType(event)
})
