import { describe, expect, it } from 'vitest'
import {
  calorificValueUncertainty,
  rectangularStandardUncertainty,
  standardUncertaintyFromExpanded,
  standardUncertaintyOfMean,
  type CalorificValueUncertaintyInput,
} from '../../../shared/domain/results/uncertainty'

// Inputs of a worked example; every expected figure below is the JCGM 100:2008 arithmetic done by hand.
const example = (over: Partial<CalorificValueUncertaintyInput> = {}): CalorificValueUncertaintyInput => ({
  energyEquivalentJPerK: { value: 10_000, standardUncertainty: 10 },
  temperatureRiseK: { value: 2.7, standardUncertainty: 0.002 },
  sampleMassG: { value: 1, standardUncertainty: 0.0002 },
  corrections: [
    { name: 'fuse', value: 96, standardUncertainty: 5 },
    { name: 'acid', value: 20, standardUncertainty: 5 },
  ],
  ...over,
})

describe('calorificValueUncertainty (JCGM 100:2008 §5.1.2, eq. 10; §6.2)', () => {
  it('reproduces the hand-computed budget', () => {
    // q = (10 000 × 2.7 − 96 − 20)/1 = 26 884 J/g
    // c_ε = θ/m = 2.7          → 2.7 × 10        = 27 J/g
    // c_θ = ε/m = 10 000       → 10 000 × 0.002  = 20 J/g
    // c_m = −q/m = −26 884     → 26 884 × 0.0002 = 5.3768 J/g
    // c_e = −1/m = −1          → 5 J/g and 5 J/g
    // u_c² = 27² + 20² + 5.3768² + 5² + 5² = 729 + 400 + 28.9100 + 25 + 25 = 1 207.9100 → u_c = 34.7550 J/g
    // U = 2 × 34.7550 = 69.5101 J/g, 0.2586 % of q
    const b = calorificValueUncertainty(example())
    expect(b.valueJPerG).toBeCloseTo(26_884, 9)
    expect(b.contributions.map((c) => c.contributionJPerG)).toEqual([
      expect.closeTo(27, 9), expect.closeTo(20, 9), expect.closeTo(5.3768, 9), expect.closeTo(5, 9), expect.closeTo(5, 9),
    ])
    expect(b.contributions.map((c) => c.sensitivity)).toEqual([
      expect.closeTo(2.7, 12), expect.closeTo(10_000, 9), expect.closeTo(-26_884, 9), -1, -1,
    ])
    expect(b.combinedStandardUncertaintyJPerG).toBeCloseTo(Math.sqrt(1207.9100), 3)
    expect(b.combinedStandardUncertaintyJPerG).toBeCloseTo(34.755, 3)
    expect(b.coverageFactor).toBe(2)
    expect(b.expandedUncertaintyJPerG).toBeCloseTo(69.510, 3)
    expect(b.relativeExpandedUncertaintyPct).toBeCloseTo((100 * 69.5101) / 26_884, 4)
  })

  it('variance shares add to 1 and the contributions add in quadrature', () => {
    const b = calorificValueUncertainty(example())
    expect(b.contributions.reduce((a, c) => a + c.varianceShare, 0)).toBeCloseTo(1, 12)
    const quadrature = Math.sqrt(b.contributions.reduce((a, c) => a + c.contributionJPerG ** 2, 0))
    expect(quadrature).toBeCloseTo(b.combinedStandardUncertaintyJPerG, 12)
  })

  it('without corrections, relative uncertainties add in quadrature (JCGM 100:2008 §5.1.6, eq. 12)', () => {
    const b = calorificValueUncertainty(example({ corrections: [] }))
    const relative = Math.sqrt((10 / 10_000) ** 2 + (0.002 / 2.7) ** 2 + (0.0002 / 1) ** 2)
    expect(b.combinedStandardUncertaintyJPerG / b.valueJPerG).toBeCloseTo(relative, 12)
  })

  it('takes another coverage factor', () => {
    expect(calorificValueUncertainty(example({ coverageFactor: 3 })).expandedUncertaintyJPerG).toBeCloseTo(3 * 34.755, 2)
  })

  it('refuses corrections as large as ε·θ', () => {
    expect(() => calorificValueUncertainty(example({ corrections: [{ name: 'aid', value: 27_000, standardUncertainty: 1 }] }))).toThrow(RangeError)
  })
})

describe('standard uncertainties of the inputs', () => {
  it('of a mean: s/√n (JCGM 100:2008 §4.2.3)', () => {
    // Six standardisation runs with s = 14.9 J/K: 14.9/√6 = 6.083 J/K.
    expect(standardUncertaintyOfMean(14.9, 6)).toBeCloseTo(14.9 / Math.sqrt(6), 12)
  })

  it('of a certificate value: U/k — NIST SRM 39j 26 434 ± 3 J/g read as k = 2 (from memory) gives 1.5 J/g', () => {
    expect(standardUncertaintyFromExpanded(3, 2)).toBe(1.5)
  })

  it('of a rectangular interval: a/√3 (JCGM 100:2008 §4.3.7) — a ±0.1 mg balance resolution gives 0.0577 mg', () => {
    expect(rectangularStandardUncertainty(0.1)).toBeCloseTo(0.1 / Math.sqrt(3), 12)
  })
})
