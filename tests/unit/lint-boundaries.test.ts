import { fileURLToPath } from 'node:url'
import { ESLint } from 'eslint'
import { beforeAll, describe, expect, it } from 'vitest'

// The client/server boundary is a lint rule (eslint.boundaries.mjs); these cases prove the project's own ESLint
// configuration fires on each crossing and stays quiet on the imports each side may make.
const root = fileURLToPath(new URL('../..', import.meta.url))
let eslint: ESLint
beforeAll(() => { eslint = new ESLint({ cwd: root }) })

async function boundaryErrors(filePath: string, code: string): Promise<string[]> {
  const [result] = await eslint.lintText(code, { filePath })
  return (result?.messages ?? []).filter(m => m.ruleId === 'import/no-restricted-paths' || m.ruleId === 'no-restricted-imports').map(m => m.message)
}
const use = (from: string) => `import { x } from '${from}'\nexport const y = x\n`

describe('the import boundary as a lint rule', () => {
  it.each([
    ['composables/useProbe.ts', '../server/utils/db'],
    ['composables/useProbe.ts', '~~/server/utils/db'],
    ['stores/probe.ts', '../server/utils/db'],
    ['server/utils/probe.ts', '../../composables/useApiError'],
    ['server/api/probe.get.ts', '~/composables/useApiError'],
    ['server/utils/probe.ts', '#app'],
    ['shared/probe.ts', '../server/utils/db'],
    ['shared/domain/probe.ts', '../../stores/preferences'],
  ])('%s may not import %s', async (file, from) => {
    expect(await boundaryErrors(file, use(from))).toHaveLength(1)
  }, 60_000)

  it('fires inside a page\'s <script setup> too', async () => {
    const page = `<script setup lang="ts">\nimport { useDb } from '../server/utils/db'\nconst db = useDb\n</script>\n\n<template>\n  <p>{{ db }}</p>\n</template>\n`
    expect(await boundaryErrors('pages/probe.vue', page)).toEqual([expect.stringContaining('never imports server/')])
  }, 60_000)

  it.each([
    ['server/api/probe.get.ts', '../utils/db'],
    ['server/utils/probe.ts', '../plugins/mail-worker'],
    ['server/database/tables/probe.ts', '../../../shared/states'],
    ['composables/useProbe.ts', '#shared/labels'],
    ['shared/domain/probe.ts', '../labels'],
  ])('%s may import %s', async (file, from) => {
    expect(await boundaryErrors(file, use(from))).toEqual([])
  }, 60_000)
})
