import { readFileSync } from 'node:fs'
import { fileURLToPath } from 'node:url'
import { describe, expect, it } from 'vitest'
import { DEFAULT_POLICY, labPolicySchema, POLICY_DESCRIPTIONS } from '#shared/domain/policy'

describe('lab policy', () => {
  it('holds the documented defaults', () => {
    expect(DEFAULT_POLICY.serviceIntervalFirings).toBe(500) // common practice
    expect(DEFAULT_POLICY.requalificationIntervalFirings).toBe(5000) // common practice
    expect([DEFAULT_POLICY.fillPressureWindowMinMPa, DEFAULT_POLICY.fillPressureWindowMaxMPa]).toEqual([2.8, 3.2]) // ISO 1928 3.0 ± 0.2 MPa (from memory)
    expect(DEFAULT_POLICY.proofChargeFillPressureMPa).toBeCloseTo(40 * 0.101325, 3) // 40 atm gauge (NIST SP 811 atmosphere)
    expect(DEFAULT_POLICY.repeatabilityJPerG).toBe(120) // ISO 1928 r (from memory)
  })

  it('accepts the defaults and refuses out-of-range or inconsistent edits, naming the field', () => {
    expect(labPolicySchema.safeParse(DEFAULT_POLICY).success).toBe(true)
    const negative = labPolicySchema.safeParse({ ...DEFAULT_POLICY, waterMl: -1 })
    expect(negative.success).toBe(false)
    expect(negative.error?.issues[0]?.path).toEqual(['waterMl'])
    const crossed = labPolicySchema.safeParse({ ...DEFAULT_POLICY, minOxygenExcess: 4 })
    expect(crossed.error?.issues.map(i => i.path.join('.'))).toContain('minOxygenExcess')
    const window = labPolicySchema.safeParse({ ...DEFAULT_POLICY, fillPressureWindowMinMPa: 3.3 })
    expect(window.success).toBe(false)
    expect(labPolicySchema.safeParse({ ...DEFAULT_POLICY, surprise: 1 }).success).toBe(false)
  })

  it('describes every field for the admin page', () => {
    expect(Object.keys(POLICY_DESCRIPTIONS).sort()).toEqual(Object.keys(DEFAULT_POLICY).sort())
    for (const d of Object.values(POLICY_DESCRIPTIONS)) {
      expect(d.label).not.toBe('')
      expect(d.source).not.toBe('')
    }
    expect(POLICY_DESCRIPTIONS.electrodeResistanceMaxOhm.source).toMatch(/^The lab's own decision/)
  })

  it('shows pages a standard and clause or the lab\'s own decision, never a provenance note', () => {
    for (const [key, d] of Object.entries(POLICY_DESCRIPTIONS)) {
      expect(d.source, key).not.toMatch(/from memory|common practice|secondary/i)
      expect(d.source, key).toMatch(/^(The lab's own decision|UN Manual of Tests and Criteria, Appendix 6, (clause|section) |NIST S|Stoichiometry|Conversion factors: NIST SP 811|ISO \d|ASTM D\d|OIML R )/)
    }
  })
})

describe('module boundaries', () => {
  const read = (file: string) => readFileSync(fileURLToPath(new URL(`../../../shared/domain/${file}`, import.meta.url)), 'utf8')
  // Type-only imports vanish at build time, so only value imports count.
  const staticImports = (source: string) => [...source.matchAll(/^import\s(?!type\s)[^;]*?from\s+'([^']+)'/gm)].map(m => m[1])
  const core = [
    'assessment/index.ts', 'assessment/contract.ts', 'assessment/schema.ts', 'assessment/resolve.ts', 'assessment/model.ts',
    'assessment/limits.ts', 'assessment/findings.ts', 'assessment/assess.ts', 'assessment/notes.ts',
    'elements.ts', 'formula-groups.ts', 'hygiene.ts', 'composition.ts', 'heating-value.ts', 'oxygen.ts', 'peak-pressure.ts', 'policy.ts', 'screening.ts', 'specific-energy.ts', 'index.ts']

  it('keeps mathjs, openchemlib and mf-parser out of the modules pages load', () => {
    for (const file of core) {
      const imports = staticImports(read(file))
      expect(imports, file).not.toContain('mathjs')
      expect(imports, file).not.toContain('openchemlib')
      expect(imports, file).not.toContain('mf-parser')
      expect(imports, file).not.toContain('./structure')
      expect(imports, file).not.toContain('../structure')
      expect(imports, file).not.toContain('./units')
    }
  })

  it('loads structure.ts and mf-parser only on demand', () => {
    expect(read('assessment/resolve.ts')).toContain("await import('../structure')")
    expect(read('composition.ts')).toContain("await import('mf-parser')")
  })
})
