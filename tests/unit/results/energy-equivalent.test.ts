import { describe, expect, it } from 'vitest'
import { energyEquivalent, seriesStatistics, type StandardisationRun } from '../../../shared/domain/results/energy-equivalent'

const SRM_39J_J_PER_G = 26_434 // NIST SRM 39j certificate, mass in vacuum
const NICHROME_J_PER_CM = 9.6 // nickel-chromium fuse wire (from memory)

const run = (over: Partial<StandardisationRun> = {}): StandardisationRun => ({
  benzoicAcidMassG: 1.0012,
  benzoicAcidJPerG: SRM_39J_J_PER_G,
  temperatureRiseK: 2.5231,
  fuseJ: 10 * NICHROME_J_PER_CM,
  acidJ: 0,
  ...over,
})

describe('energyEquivalent (ASTM D240 §8; ISO 1928)', () => {
  it('divides the heat released by the corrected rise', () => {
    // m·q = 1.0012 g × 26 434 J/g = 26 465.7208 J; + 96 J fuse = 26 561.7208 J; / 2.5231 K = 10 527.4150 J/K.
    const expected = (1.0012 * SRM_39J_J_PER_G + 96) / 2.5231
    expect(energyEquivalent(run())).toBeCloseTo(expected, 9)
    expect(energyEquivalent(run())).toBeCloseTo(10_527.415, 2)
  })

  it('adds the acid and aid corrections', () => {
    // e_acid: 8.5 mL of 0.0725 mol/L titrant × 59.7 kJ/mol (ISO 1928, from memory) = 36.79 J.
    const acidJ = 8.5 * (0.0725 / 1000) * 59_700
    const expected = (1.0012 * SRM_39J_J_PER_G + 96 + acidJ + 150) / 2.5231
    expect(energyEquivalent(run({ acidJ, aidJ: 150 }))).toBeCloseTo(expected, 9)
  })

  it('refuses a zero rise or a negative correction', () => {
    expect(() => energyEquivalent(run({ temperatureRiseK: 0 }))).toThrow(RangeError)
    expect(() => energyEquivalent(run({ fuseJ: -1 }))).toThrow(RangeError)
  })
})

describe('seriesStatistics', () => {
  // Six runs as ASTM D240 §8.1 asks for (at least six, over at least three days), spread by ±1 and ±2 parts per
  // thousand around a centre, so the statistics can be worked by hand.
  const centre = energyEquivalent(run())
  const spread = [-2, -1, 0, 0, 1, 2].map((d) => centre * (1 + d / 1000))
  const policy = { minRuns: 6, maxRsdPct: 0.2 } // lab policy example: ASTM D240 run count, ISO 1928 0.20 % (from memory)

  it('gives the mean, the sample standard deviation and the RSD (JCGM 100:2008 §4.2)', () => {
    const s = seriesStatistics(spread, policy)
    expect(s.n).toBe(6)
    expect(s.mean).toBeCloseTo(centre, 8)
    // s² = centre²·(4 + 1 + 0 + 0 + 1 + 4)·10⁻⁶/(6 − 1) = 2·10⁻⁶·centre² → RSD = √2 × 0.1 % = 0.1414 %.
    expect(s.standardDeviation).toBeCloseTo(centre * Math.sqrt(2) / 1000, 8)
    expect(s.relativeStandardDeviationPct).toBeCloseTo(Math.sqrt(2) / 10, 10)
    expect(s.accepted).toBe(true)
    expect(s.reason).toBeNull()
  })

  it('refuses a series with too few runs, saying so', () => {
    const s = seriesStatistics(spread.slice(0, 5), policy)
    expect(s.accepted).toBe(false)
    expect(s.reason).toBe('Only 5 runs; the method needs at least 6.')
  })

  it('refuses a series above the RSD limit, with the figures', () => {
    const wide = [-4, -2, 0, 0, 2, 4].map((d) => centre * (1 + d / 1000)) // RSD = 2√2 × 0.1 % = 0.283 %
    const s = seriesStatistics(wide, policy)
    expect(s.relativeStandardDeviationPct).toBeCloseTo(Math.sqrt(2) / 5, 10)
    expect(s.accepted).toBe(false)
    expect(s.reason).toBe('The relative standard deviation is 0.283 %, above the limit of 0.200 %.')
  })

  it('handles empty and single-run series without inventing a spread', () => {
    expect(seriesStatistics([], policy)).toMatchObject({ n: 0, mean: null, standardDeviation: null, accepted: false })
    expect(seriesStatistics([centre], policy)).toMatchObject({ n: 1, mean: centre, standardDeviation: null, relativeStandardDeviationPct: null })
  })
})
