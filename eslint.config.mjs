// Lint: the Nuxt team's shared rules (TypeScript + Vue), stylistic rules on. `npm run lint`.
import { createConfigForNuxt } from '@nuxt/eslint-config/flat'

export default createConfigForNuxt({ features: { stylistic: true } })
  .prepend({ ignores: ['.output/**', '.nuxt/**', '.data/**', 'node_modules/**', 'test-results/**', 'drizzle/**', 'coverage/**'] })
  .append({
    rules: {
      // short guard clauses read better on one line
      '@stylistic/max-statements-per-line': 'off',
    },
  })
  .append({
    // tests poke at JSON answers whose shape the test itself asserts
    files: ['tests/**'],
    rules: { '@typescript-eslint/no-explicit-any': 'off' },
  })
