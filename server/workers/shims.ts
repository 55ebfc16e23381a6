// Stand-ins for the two Nitro auto-imports that service code reaches inside a worker thread (esbuild
// injects them into the worker bundle). Errors they raise travel back as plain data; the pool turns them
// into the same HTTP errors the route would have raised on the main thread.
import { EngineInputError } from '#shared/engine'

export class WorkerHttpError extends Error {
  constructor(readonly statusCode: number, message: string, readonly data?: unknown) {
    super(message)
  }
}

export function createError(input: { statusCode?: number, message?: string, data?: unknown }) {
  return new WorkerHttpError(input.statusCode ?? 500, input.message ?? 'Server error', input.data)
}

export function withEngine<T>(compute: () => T, fieldPrefix = ''): T {
  try {
    return compute()
  }
  catch (err) {
    if (err instanceof EngineInputError && fieldPrefix) throw err.under(fieldPrefix)
    throw err
  }
}
