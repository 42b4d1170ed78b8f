import { readFileSync } from 'node:fs'
import { describe, expect, it } from 'vitest'
import { MATERIAL_CATEGORIES } from '../../../shared/schemas/materials'

// The benchmark's large lab (scripts/bench-seed.ts) is loaded in plain SQL, outside the app's validation, and CI does
// not run the benchmark: a category the database's check constraint refuses only showed when someone ran it.
describe('benchmark seed', () => {
  it('gives its load materials categories the database accepts', () => {
    const source = readFileSync(new URL('../../../scripts/bench-seed.ts', import.meta.url), 'utf8')
    const insert = source.slice(source.indexOf('insert into materials'))
    const literal = insert.match(/\(array\[([^\]]+)\]\)/)
    expect(literal).not.toBeNull()
    const categories = [...literal![1]!.matchAll(/'([^']+)'/g)].map(m => m[1])
    expect(categories.length).toBeGreaterThan(0)
    for (const c of categories) expect(MATERIAL_CATEGORIES).toContain(c)
  })
})
