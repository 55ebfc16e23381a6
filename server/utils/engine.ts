import { EngineInputError } from '#shared/engine'
import { plainMessage, plainSummary } from '#shared/schemas/messages'

/** Runs the engine; an input the engine refuses becomes a 422 naming the field. */
export function withEngine<T>(compute: () => T, fieldPrefix = ''): T {
  try {
    return compute()
  }
  catch (err) {
    if (err instanceof EngineInputError) {
      const path = fieldPrefix ? `${fieldPrefix}.${err.field}` : err.field
      const issue = { path, message: plainMessage(path, err.message) }
      throw createError({ statusCode: 422, message: plainSummary(issue, 'The input is not valid.'), data: { issues: [issue] } })
    }
    throw err
  }
}
