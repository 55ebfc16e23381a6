// Validation without evaluation, for schemas and forms: the same checks evaluateStress / evaluateDesign run.
import type { StressInput } from './types'
import { resolveStressInput } from './validate'

export { checkDesignInput } from './design'

/** Throws EngineInputError naming the field when evaluateStress would refuse the input. */
export function checkStressInput(input: StressInput): void {
  resolveStressInput(input)
}
