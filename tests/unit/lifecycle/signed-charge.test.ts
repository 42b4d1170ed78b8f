import { describe, expect, it } from 'vitest'
import type { Assessment, Finding } from '../../../shared/domain/assessment'
import { findingChanges, findingNumbersChanged, massExcess, sampleMassG } from '../../../shared/domain/signed-charge'

// What a signature covers at the firing. Tolerance 2 % is the lab policy default (common practice).
describe('massExcess', () => {
  it('refuses 0.94 g weighed on 0.90 g signed: +4.4 % above a 2 % tolerance', () => {
    const m = massExcess(0.9, 0.94, 2)
    expect(m.exceeded).toBe(true)
    expect(m.excessPct).toBeCloseTo(4.444, 3)
    expect(m.words).toBe('weighed 0.94 g, signed 0.90 g: +4.4 % above the 2 % tolerance')
  })

  it('covers a mass exactly at the tolerance and any lighter mass', () => {
    expect(massExcess(0.9, 0.918, 2).exceeded).toBe(false)
    expect(massExcess(0.9, 0.5, 2).exceeded).toBe(false)
    expect(massExcess(0.9, 0.5, 2).words).toMatch(/−44\.4 % within/)
  })
})

const f = (code: string, severity: Finding['severity'], data?: Record<string, unknown>) => ({ code, severity, message: code, data }) as unknown as Finding
const a = (...findings: Finding[]) => ({ findings }) as unknown as Assessment

describe('findingChanges', () => {
  it('finds new approvals and blocks by code, and leaves notes out', () => {
    const before = a(f('energy-near-rating', 'approval'))
    const after = a(f('energy-near-rating', 'approval'), f('oxygen-low', 'approval'), f('energy-over-rating', 'block'), f('suggested-mass', 'info'))
    const c = findingChanges(before, after, 2, true)
    expect(c.approvals.map(x => x.code)).toEqual(['oxygen-low'])
    expect(c.blocks.map(x => x.code)).toEqual(['energy-over-rating'])
  })

  it('on a signed charge, counts an approval whose numbers moved beyond the tolerance as new', () => {
    // 0.90 g → 0.94 g of a sample near a 33 kJ rating: the heat release moves by 4.4 %.
    const before = a(f('energy-near-rating', 'approval', { heatReleaseJ: 31_500, thresholdJ: 29_700 }))
    const after = a(f('energy-near-rating', 'approval', { heatReleaseJ: 32_900, thresholdJ: 29_700 }))
    expect(findingChanges(before, after, 2, true).approvals).toHaveLength(1)
    expect(findingChanges(before, after, 2, false).approvals).toHaveLength(0)
    const close = a(f('energy-near-rating', 'approval', { heatReleaseJ: 31_600, thresholdJ: 29_700 }))
    expect(findingChanges(before, close, 2, true).approvals).toHaveLength(0)
  })

  it('treats a number that appears or goes as a change', () => {
    expect(findingNumbersChanged(f('x', 'approval', { a: 1 }), f('x', 'approval', { a: 1, b: 2 }), 2)).toBe(true)
    expect(findingNumbersChanged(f('x', 'approval', { a: 1, note: 'text' }), f('x', 'approval', { a: 1 }), 2)).toBe(false)
  })
})

describe('sampleMassG', () => {
  it('adds the sample components only', () => {
    expect(sampleMassG([{ role: 'sample', massG: 0.3 }, { role: 'sample', massG: 0.2 }, { role: 'aid', massG: 0.5 }])).toBeCloseTo(0.5, 12)
  })
})
