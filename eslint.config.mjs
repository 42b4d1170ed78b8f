// @nuxt/eslint generates the project-aware flat config in .nuxt/ (nuxt prepare).
import withNuxt from './.nuxt/eslint.config.mjs'
import boundaries from './eslint.boundaries.mjs'

export default withNuxt(
  { ignores: ['.data/**', '.output/**', 'server/database/migrations/**', 'tests/.artifacts/**'] },
  { rules: { 'vue/multi-word-component-names': 'off', '@typescript-eslint/no-explicit-any': 'error' } },
  // Tests read JSON answers loosely on purpose.
  { files: ['tests/**'], rules: { '@typescript-eslint/no-explicit-any': 'off' } },
  ...boundaries,
)
