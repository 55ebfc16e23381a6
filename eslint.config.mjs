// Lint: the Nuxt team's shared rules (TypeScript + Vue), stylistic rules on. `npm run lint`.
import { createConfigForNuxt } from '@nuxt/eslint-config/flat'

export default createConfigForNuxt({ features: { stylistic: true } })
  .prepend({ ignores: ['.output/**', '.nuxt/**', '.data/**', 'node_modules/**', 'test-results/**', 'drizzle/**', 'coverage/**'] })
