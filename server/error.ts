// Runs before Nuxt's own error handler: turns database failures that reach a route into answers a
// person can act on instead of "Server Error" (500):
// - PostgreSQL unreachable (refused, timed out, restarting, out of connections) → 503 "the database
//   is unavailable, try again" with Retry-After;
// - two requests changing the same rows at once (unique violation, serialization failure, deadlock)
//   → 409, try again;
// - a value PostgreSQL refuses (out of range, NUL in text) that validation let through → 422.
// It only rewrites the error; Nuxt's handler still renders the page or the JSON.
import { setResponseHeader, type H3Error, type H3Event } from 'h3'

const CONNECTION_CODES = new Set([
  'ECONNREFUSED', 'ECONNRESET', 'ETIMEDOUT', 'EHOSTUNREACH', 'ENETUNREACH', 'ENOTFOUND', 'EPIPE', 'EAI_AGAIN',
  // postgres.js
  'CONNECT_TIMEOUT', 'CONNECTION_CLOSED', 'CONNECTION_ENDED', 'CONNECTION_DESTROYED',
  // PostgreSQL: shutting down, starting up, too many connections
  '57P01', '57P02', '57P03', '53300',
])

/** The first error in the cause chain that carries a code (postgres.js and Node put it there). */
function codeOf(error: unknown): string | undefined {
  let e = error as { code?: unknown, cause?: unknown, errors?: unknown[] } | undefined
  for (let depth = 0; e && depth < 8; depth++) {
    if (typeof e.code === 'string') return e.code
    // AggregateError from a connection attempt to several addresses
    if (Array.isArray(e.errors) && e.errors.length) { e = e.errors[0] as typeof e; continue }
    e = e.cause as typeof e
  }
  return undefined
}

export function databaseStatus(error: unknown): { statusCode: number, message: string } | null {
  const code = codeOf(error)
  if (!code) return null
  if (CONNECTION_CODES.has(code) || code.startsWith('08')) return { statusCode: 503, message: 'The database is unavailable, try again in a moment.' }
  if (code === '23505' || code === '40001' || code === '40P01' || code === '55P03') return { statusCode: 409, message: 'Someone else changed the same data at the same moment. Reload and try again.' }
  if (code === '22003') return { statusCode: 422, message: 'A number is larger than the database can store.' }
  if (code === '22021' || code === '22P05' || code === '22P02') return { statusCode: 422, message: 'A value contains characters or a format the database cannot store.' }
  return null
}

export default async function databaseErrorHandler(error: H3Error, event: H3Event) {
  if (error.statusCode && error.statusCode !== 500) return
  const mapped = databaseStatus(error)
  if (!mapped) return
  error.statusCode = mapped.statusCode
  error.statusMessage = mapped.statusCode === 503 ? 'Service Unavailable' : mapped.statusCode === 409 ? 'Conflict' : 'Unprocessable Entity'
  error.message = mapped.message
  error.unhandled = false
  if (mapped.statusCode === 503) setResponseHeader(event, 'Retry-After', 5)
  console.error(`[stratavolt] ${event.method} ${event.path}: database error ${codeOf(error)} answered ${mapped.statusCode}`)
}
