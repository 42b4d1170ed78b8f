import { describe, expect, it } from 'vitest'
import {
  asFiredFractions,
  assertComposition,
  compositionFromFormula,
  CompositionError,
  compositionProblems,
  molarMassGPerMol,
  toDryBasis,
} from '#shared/domain/composition'

describe('composition from a molecular formula', () => {
  it('gives benzoic acid its molar mass and mass-%', async () => {
    const ba = await compositionFromFormula('C7H6O2')
    expect(ba.atoms).toEqual({ C: 7, H: 6, O: 2 })
    // 7·12.011 + 6·1.008 + 2·15.999 = 122.123 g/mol (IUPAC atomic weights; REFERENCES: 122.12)
    expect(ba.molarMassGPerMol).toBeCloseTo(122.123, 3)
    // 84.077 / 122.123 = 68.85 % C, 6.048 / 122.123 = 4.95 % H, 31.998 / 122.123 = 26.20 % O (IUPAC atomic weights)
    expect(ba.composition.C).toBeCloseTo(68.85, 2)
    expect(ba.composition.H).toBeCloseTo(4.95, 2)
    expect(ba.composition.O).toBeCloseTo(26.2, 2)
    expect(ba.composition.basis).toBe('dry')
  })

  it('reads condensed formulas and counts other elements as ash', async () => {
    const an = await compositionFromFormula('NH4NO3')
    expect(an.atoms).toEqual({ H: 4, N: 2, O: 3 })
    expect(an.molarMassGPerMol).toBeCloseTo(80.043, 3) // 4·1.008 + 2·14.007 + 3·15.999 (IUPAC atomic weights)
    const kclo4 = await compositionFromFormula('KClO4')
    // K: 39.098 / 138.546 = 28.22 % (IUPAC atomic weights) is residue, so it is ash.
    expect(kclo4.composition.ash).toBeCloseTo(28.22, 2)
  })

  it('rejects unknown elements and unreadable text with a clear error', async () => {
    await expect(compositionFromFormula('C7Xx2')).rejects.toThrow(CompositionError)
    await expect(compositionFromFormula('C7Xx2')).rejects.toThrow(/Formula "C7Xx2" cannot be read: Unknown element: Xx/)
    await expect(compositionFromFormula('c7h6o2')).rejects.toThrow(/cannot be read/)
    await expect(compositionFromFormula('  ')).rejects.toThrow(/empty/)
  })

  it('sums molar masses from counts', () => {
    expect(molarMassGPerMol({ C: 12, H: 22, O: 11 })).toBeCloseTo(342.297, 3) // sucrose, IUPAC atomic weights
  })
})

describe('composition checks', () => {
  it('accepts an analysis summing to 100 % within the 0.5 % tolerance and refuses one beyond', () => {
    expect(compositionProblems({ C: 60, H: 5, O: 20, ash: 10, moisture: 5.5 })).toEqual([]) // 100.5 % (tolerance: common practice)
    expect(compositionProblems({ C: 60, H: 5, O: 20, ash: 10, moisture: 5.6 })).toHaveLength(1) // 100.6 %
    expect(() => assertComposition({ C: 60, H: 5, O: 20, ash: 10, moisture: 5.6 })).toThrow(/add up to 100.6 %/)
  })

  it('refuses negative figures', () => {
    expect(compositionProblems({ C: -1 })).toEqual(['C is negative (-1 %)'])
  })

  it('leaves moisture out of a dry-basis sum', () => {
    expect(compositionProblems({ C: 70, H: 5, O: 15, ash: 10, moisture: 12, basis: 'dry' })).toEqual([])
  })
})

describe('bases', () => {
  it('converts as-received to dry with x·100/(100 − M)', () => {
    const dry = toDryBasis({ C: 45, H: 5, O: 30, ash: 10, moisture: 10 })
    expect(dry.C).toBeCloseTo(50, 10) // 45·100/90 (ASTM D3180 / ISO 1170)
    expect(dry.ash).toBeCloseTo(11.1111, 4) // 10·100/90 (ASTM D3180)
    expect(dry.moisture).toBe(10)
  })

  it('gives as-fired fractions from a dry analysis with (1 − M/100)', () => {
    const f = asFiredFractions({ C: 50, H: 6, O: 40, moisture: 20, basis: 'dry' })
    expect(f.C).toBeCloseTo(0.4, 12) // 50 % × (1 − 0.2) (ASTM D3180)
    expect(f.moisture).toBeCloseTo(0.2, 12)
  })
})
