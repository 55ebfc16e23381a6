import type { H3Event } from 'h3'
import type { z } from 'zod'
import { labelOf, plainIssues, plainSummary } from '#shared/schemas/messages'

/** zod issues as { path, message } pairs a form can put beside its fields: machine path, message in plain words naming the field's label. */
export function issuesOf(error: z.ZodError) {
  return plainIssues(error.issues.map(i => ({ path: i.path.join('.'), message: i.message })))
}

function fail(statusCode: number, what: string, error: z.ZodError): never {
  const issues = issuesOf(error)
  throw createError({
    statusCode,
    message: plainSummary(issues[0], `${what}: the request is not valid.`),
    data: { issues },
  })
}

/** Deepest nesting of arrays / objects a JSON body may have (the deepest schema needs about 6). */
export const MAX_JSON_DEPTH = 32

/** Routes that take a file upload (multipart/form-data) instead of a JSON body. */
export function isUploadRoute(path: string) {
  return /^\/api\/catalog\/imports\/?(?:\?|$)/.test(path)
}

/** Nesting depth of a JSON text, counted without parsing (so a deep body cannot exhaust the stack). */
export function jsonDepth(text: string): number {
  let depth = 0
  let max = 0
  let inString = false
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i)
    if (inString) {
      if (c === 92) i++ // backslash: skip the escaped character
      else if (c === 34) inString = false
      continue
    }
    if (c === 34) inString = true
    else if (c === 91 || c === 123) { if (++depth > max) max = depth }
    else if (c === 93 || c === 125) depth--
  }
  return max
}

/** Reads and validates a JSON body: 400 when it is not JSON, not an object or nested too deep, 422 when a field is wrong. */
export async function readValid<T extends z.ZodType>(event: H3Event, schema: T, invalidStatus = 422): Promise<z.infer<T>> {
  const text = await readRawBody(event, 'utf8').catch(() => undefined)
  return parseValid(text, schema, invalidStatus)
}

/**
 * readValid's checks of the body text, on any thread (a worker thread validates the body of `/api/v1/stress` and
 * `/evaluate` before computing: the errors it throws travel back and are answered as raised here).
 */
export function parseValid<T extends z.ZodType>(text: string | undefined, schema: T, invalidStatus = 422): z.infer<T> {
  if (text && jsonDepth(text) > MAX_JSON_DEPTH) {
    throw createError({ statusCode: 400, message: `The request body is nested deeper than ${MAX_JSON_DEPTH} levels.` })
  }
  let body: unknown
  try {
    body = text ? JSON.parse(text) : undefined
  }
  catch {
    throw createError({ statusCode: 400, message: 'The request body is not valid JSON.' })
  }
  if (body === undefined || body === null || typeof body !== 'object' || Array.isArray(body)) {
    throw createError({ statusCode: 400, message: 'The request body must be a JSON object.' })
  }
  const nul = pathWithNul(body)
  if (nul !== null) {
    throw createError({ statusCode: 422, message: `${labelOf(nul)} contains a NUL character: remove it.`, data: { issues: [{ path: nul, message: `${labelOf(nul)} contains a NUL character: remove it.` }] } })
  }
  const r = schema.safeParse(body)
  if (!r.success) fail(invalidStatus, 'Invalid field', r.error)
  return r.data
}

/** Path of the first string (or key) holding a NUL character, which PostgreSQL text cannot store; null when none. */
function pathWithNul(value: unknown, path: string[] = []): string | null {
  if (typeof value === 'string') return value.includes('\u0000') ? path.join('.') : null
  if (value && typeof value === 'object') {
    for (const [k, v] of Object.entries(value)) {
      if (k.includes('\u0000')) return [...path, k].join('.')
      const found = pathWithNul(v, [...path, k])
      if (found !== null) return found
    }
  }
  return null
}

export function queryValid<T extends z.ZodType>(event: H3Event, schema: T): z.infer<T> {
  const r = schema.safeParse(getQuery(event))
  if (!r.success) fail(400, 'Invalid query parameter', r.error)
  return r.data
}

export function paramsValid<T extends z.ZodType>(event: H3Event, schema: T): z.infer<T> {
  const r = schema.safeParse(getRouterParams(event))
  if (!r.success) fail(400, 'Invalid path parameter', r.error)
  return r.data
}

/**
 * An uploaded file's name as the app stores and shows it: no control characters or NUL (PostgreSQL
 * text refuses NUL), no folder part, at most 200 characters; empty → "upload".
 */
export function cleanFileName(name: string): string {
  // eslint-disable-next-line no-control-regex
  const base = name.replace(/[\u0000-\u001f\u007f-\u009f]/g, '').split(/[/\\]/).pop()!.trim()
  const short = base.length > 200 ? base.slice(-200) : base
  return short || 'upload'
}

/** A database failure in words for the health route (no connection strings or stack). */
export function databaseProblem(err: unknown): string {
  const code = (err as { code?: string, cause?: { code?: string } })?.code ?? (err as { cause?: { code?: string } })?.cause?.code
  return code ? `the database is unavailable (${code})` : 'the database is unavailable'
}
