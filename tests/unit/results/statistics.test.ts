import { describe, expect, it } from 'vitest'
import { linearFit, mean, median, range, sampleStandardDeviation } from '../../../shared/domain/results/statistics'

// Textbook figures worked by hand beside each assertion (JCGM 100:2008 §4.2 for the mean and s).
describe('statistics', () => {
  it('mean and sample standard deviation (n − 1)', () => {
    // 2, 4, 4, 4, 5, 5, 7, 9: mean 5, Σ(x − 5)² = 32, s = √(32/7) = 2.138
    const xs = [2, 4, 4, 4, 5, 5, 7, 9]
    expect(mean(xs)).toBe(5)
    expect(sampleStandardDeviation(xs)).toBeCloseTo(Math.sqrt(32 / 7), 12)
  })

  it('median of odd and even series, without reordering the input', () => {
    const xs = [3, 1, 2]
    expect(median(xs)).toBe(2)
    expect(median([4, 1, 3, 2])).toBe(2.5)
    expect(xs).toEqual([3, 1, 2])
  })

  it('range and least-squares line', () => {
    expect(range([26_434, 26_380, 26_501])).toBe(121)
    // y = 23.5 + 0.001·t exactly
    const fit = linearFit([0, 5, 10, 15], [23.5, 23.505, 23.51, 23.515])
    expect(fit.slope).toBeCloseTo(0.001, 12)
    expect(fit.intercept).toBeCloseTo(23.5, 12)
  })

  it('refuses series too short to have the statistic', () => {
    expect(() => mean([])).toThrow(RangeError)
    expect(() => sampleStandardDeviation([1])).toThrow(RangeError)
    expect(() => linearFit([1, 1], [2, 3])).toThrow(RangeError)
  })
})
