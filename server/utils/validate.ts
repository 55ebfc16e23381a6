import type { H3Event } from 'h3'
import type { z } from 'zod'

/** zod issues as { path, message } pairs a form can put beside its fields. */
export function issuesOf(error: z.ZodError) {
  return error.issues.map(i => ({ path: i.path.join('.'), message: i.message }))
}

function fail(statusCode: number, what: string, error: z.ZodError): never {
  const issues = issuesOf(error)
  const first = issues[0]
  throw createError({
    statusCode,
    message: first ? `${what}: ${first.path || 'value'} — ${first.message}` : `${what} is not valid`,
    data: { issues },
  })
}

/** Reads and validates a JSON body: 400 when it is not JSON or not an object, 422 when a field is wrong. */
export async function readValid<T extends z.ZodType>(event: H3Event, schema: T, invalidStatus = 422): Promise<z.infer<T>> {
  let body: unknown
  try {
    body = await readBody(event)
  }
  catch {
    throw createError({ statusCode: 400, message: 'The request body is not valid JSON.' })
  }
  if (body === undefined || body === null || typeof body !== 'object' || Array.isArray(body)) {
    throw createError({ statusCode: 400, message: 'The request body must be a JSON object.' })
  }
  const r = schema.safeParse(body)
  if (!r.success) fail(invalidStatus, 'Invalid field', r.error)
  return r.data
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
