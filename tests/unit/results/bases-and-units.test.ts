import { describe, expect, it } from 'vitest'
import {
  aidSeries, buoyancyFactor, DEFAULT_BUOYANCY_DENSITIES, mineralMatterFreeValue, mineralMatterPct, pooledStandardDeviation,
  standardDeviationFromLimit, valuePerMassWeighedInAir,
} from '../../../shared/domain/results'
import { formatSpecificEnergy, fromJPerG, toJPerG } from '../../../shared/domain/specific-energy'
import { convertSpecificEnergy } from '../../../shared/domain/units'

describe('thermochemical calorie beside the international-table calorie', () => {
  it('1 cal_th = 4.184 J and 1 cal_IT = 4.1868 J (NIST SP 811, Appendix B)', () => {
    expect(fromJPerG(4184, 'cal_th/g')).toBeCloseTo(1000, 10)
    expect(toJPerG(1000, 'cal/g')).toBeCloseTo(4186.8, 10)
    expect(convertSpecificEnergy(1, 'cal_th/g', 'cal_IT/g')).toBeCloseTo(4.184 / 4.1868, 12)
    expect(convertSpecificEnergy(26_434, 'J/g', 'cal_th/g')).toBeCloseTo(fromJPerG(26_434, 'cal_th/g'), 9)
    expect(formatSpecificEnergy(26_434, 'cal_th/g')).toBe('6,317.9 cal_th/g')
  })
})

describe('mineral-matter-free basis (ASTM D388, from memory)', () => {
  it('MM = 1.08·A + 0.55·S', () => {
    expect(mineralMatterPct(10, 2)).toBeCloseTo(11.9, 12)
  })

  it('agrees with the formula in Btu/lb: (12 000 − 50·2)/(100 − 11.9)·100 = 13 507.4 Btu/lb', () => {
    // The ASTM D388 formula is written in Btu/lb with 50 Btu/lb per % S; in J/g the same value (1 Btu/lb = 2.326 J/g, NIST SP 811).
    const btu = ((12_000 - 50 * 2) / (100 - 11.9)) * 100
    expect(btu).toBeCloseTo(13_507.38, 2)
    expect(mineralMatterFreeValue(12_000 * 2.326, 10, 2)).toBeCloseTo(btu * 2.326, 6)
  })

  it('refuses impossible figures', () => {
    expect(() => mineralMatterPct(-1, 0)).toThrow(RangeError)
    expect(() => mineralMatterFreeValue(20_000, 95, 0)).toThrow(RangeError)
  })
})

describe('air buoyancy', () => {
  it('factor (1 − 0.0012/8.0)/(1 − 0.0012/1.32) = 1.000760 with the OIML R 111 air and weight densities (from memory)', () => {
    expect(buoyancyFactor(DEFAULT_BUOYANCY_DENSITIES)).toBeCloseTo((1 - 0.0012 / 8) / (1 - 0.0012 / 1.32), 15)
    expect(buoyancyFactor(DEFAULT_BUOYANCY_DENSITIES)).toBeCloseTo(1.00076, 5)
    // NIST SRM 39j: 26 434 J/g in vacuum ↔ 26 454 J/g weighed in air (certificates state both).
    expect(valuePerMassWeighedInAir(26_434, DEFAULT_BUOYANCY_DENSITIES)).toBeCloseTo(26_454, 0)
    expect(() => buoyancyFactor({ airGPerMl: 2, substanceGPerMl: 1.32, weightsGPerMl: 8 })).toThrow(RangeError)
  })
})

describe('repeatability and the lab\'s own series', () => {
  it('s_r = r/2.8 (ISO 5725-6): r = 120 J/g → 42.86 J/g; R = 300 J/g → s_R = 107.1 J/g (ISO 1928)', () => {
    expect(standardDeviationFromLimit(120)).toBeCloseTo(42.857, 3)
    expect(standardDeviationFromLimit(300)).toBeCloseTo(107.14, 2)
  })

  it('pools duplicates: pairs differing by d give s² = Σd²/(2k) (ISO 5725-2)', () => {
    const pairs = [[27_000, 27_060], [25_100, 25_040], [30_000, 30_030]]
    const p = pooledStandardDeviation(pairs)!
    expect(p.degreesOfFreedom).toBe(3)
    expect(p.standardDeviation).toBeCloseTo(Math.sqrt((60 ** 2 + 60 ** 2 + 30 ** 2) / 6), 9)
    expect(pooledStandardDeviation([[1]])).toBeNull()
  })

  it('an aid series gives mean, s and u = s/√n (JCGM 100:2008 §4.2.3), accepted from three runs within 1 %', () => {
    const s = aidSeries([18_010, 18_060, 18_035, 18_055])
    expect(s.meanJPerG).toBeCloseTo(18_040, 9)
    const sd = Math.sqrt(((-30) ** 2 + 20 ** 2 + (-5) ** 2 + 15 ** 2) / 3)
    expect(s.standardDeviationJPerG).toBeCloseTo(sd, 9)
    expect(s.standardUncertaintyJPerG).toBeCloseTo(sd / 2, 9)
    expect(s.accepted).toBe(true)
    expect(aidSeries([18_000, 18_050]).accepted).toBe(false)
    expect(aidSeries([18_000, 19_000, 17_000]).reason).toMatch(/relative standard deviation/)
  })
})
