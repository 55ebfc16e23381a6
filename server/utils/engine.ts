import { EngineInputError } from '#shared/engine'

/** Runs the engine; an input the engine refuses becomes a 422 naming the field. */
export function withEngine<T>(compute: () => T, fieldPrefix = ''): T {
  try {
    return compute()
  }
  catch (err) {
    if (err instanceof EngineInputError) {
      const path = fieldPrefix ? `${fieldPrefix}.${err.field}` : err.field
      throw createError({ statusCode: 422, message: `Invalid field: ${path} — ${err.message}`, data: { issues: [{ path, message: err.message }] } })
    }
    throw err
  }
}
