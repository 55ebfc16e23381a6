// Errors the engine raises for input it cannot evaluate; the route maps them to 422 with the field path.

/** Invalid input: `field` is the dotted path of the offending input field (e.g. "levels", "machineSide.operatingPoints.1.powerFactor"). */
export class EngineInputError extends Error {
  readonly field: string

  constructor(field: string, message: string) {
    super(message)
    this.name = 'EngineInputError'
    this.field = field
  }

  /** The same error with its field nested under a parent path (design inputs wrap single evaluations). */
  under(prefix: string): EngineInputError {
    return new EngineInputError(prefix ? `${prefix}.${this.field}` : this.field, this.message)
  }
}
