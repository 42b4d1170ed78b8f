import { describe, expect, it } from 'vitest'
import { MOVING_RANGE_D2, controlChart, controlLimits, type ControlChartOptions } from '../../../shared/domain/results/control-chart'

// Series written in σ units around a given centre, so each rule is exercised on its own.
const CENTRE = 10_500 // J/K, an energy equivalent of the size 1 g of NIST SRM 39j (26 434 J/g) gives over 2.5 K
const SIGMA = 10
const given = { baseline: { mean: CENTRE, sigma: SIGMA }, unit: 'J/K' }
const series = (...z: number[]) => z.map((v) => CENTRE + v * SIGMA)
// Alternating ±0.5σ filler: never beyond a limit, never a run of two on one side, never a trend of three.
const filler = (n: number) => Array.from({ length: n }, (_, i) => (i % 2 === 0 ? 0.5 : -0.5))
const rulesAt = (values: number[], options: ControlChartOptions = given) => controlChart(values, options).points.map((p) => p.violations.map((v) => v.rule))

describe('control limits', () => {
  it('d2 for moving ranges of two is 2/√π = 1.128 (ISO 7870-2 table of constants)', () => {
    expect(MOVING_RANGE_D2).toBeCloseTo(1.128, 3)
  })

  it('warning at ±2σ and action at ±3σ from a given mean and σ (ISO 7870-2; Western Electric handbook 1956)', () => {
    const l = controlLimits([], given)
    expect(l).toMatchObject({ centre: 10_500, sigma: 10, upperWarning: 10_520, lowerWarning: 10_480, upperAction: 10_530, lowerAction: 10_470, sigmaEstimate: 'given', baselinePoints: null })
  })

  it('σ from the first n points by mean moving range / d2, or by standard deviation', () => {
    // Alternating ±a: every moving range is 2a, so σ = 2a/d2 = a·√π; the sample SD of 2k points is a·√(2k/(2k − 1)).
    const a = 8
    const values = Array.from({ length: 20 }, (_, i) => CENTRE + (i % 2 === 0 ? a : -a))
    const mr = controlLimits([...values, 99_999], { baseline: { points: 20 } })
    expect(mr.centre).toBeCloseTo(CENTRE, 9)
    expect(mr.sigma).toBeCloseTo(a * Math.sqrt(Math.PI), 9)
    expect(mr.baselinePoints).toBe(20)
    const sd = controlLimits(values, { baseline: { points: 20 }, sigmaEstimate: 'standard-deviation' })
    expect(sd.sigma).toBeCloseTo(a * Math.sqrt(20 / 19), 9)
  })

  it('refuses a baseline it cannot use', () => {
    expect(() => controlLimits([1, 2, 3], { baseline: { points: 5 } })).toThrow(RangeError)
    expect(() => controlLimits([5, 5, 5], { baseline: { points: 3 } })).toThrow(RangeError)
  })
})

describe('rules (ISO 7870-2 tests 1, 5, 2, 3; Western Electric handbook 1956 rules 1, 2, 4)', () => {
  it('one point beyond 3σ; exactly 3σ is not beyond', () => {
    expect(rulesAt(series(3.0, -3.0))).toEqual([[], []])
    const chart = controlChart(series(0.5, 3.1), given)
    expect(chart.points[1]?.violations).toEqual([
      { rule: 'beyond-action-limit', indices: [1], message: 'Point 2 (10,531.0 J/K) lies above the upper action limit (10,530.0 J/K, +3σ).' },
    ])
    expect(chart.points[1]?.zone).toBe('beyond-action')
    expect(chart.outOfControl).toBe(true)
  })

  it('two of three beyond the same 2σ limit', () => {
    expect(rulesAt(series(2.5, 0, 2.5))[2]).toEqual(['two-of-three-beyond-warning'])
    expect(rulesAt(series(2.5, -2.5, 0.5))).toEqual([[], [], []]) // opposite sides do not count
    expect(rulesAt(series(2.5, 0, 0, 2.5))).toEqual([[], [], [], []]) // two of four is not two of three
    const p = controlChart(series(0, -2.2, -2.6), given).points[2]
    expect(p?.violations[0]?.message).toBe('Points 1–3: 2 of 3 lie beyond the lower warning limit (10,480.0 J/K, −2σ).')
  })

  it('nine in a row on one side by default; eight with the Western Electric run length', () => {
    const run = series(...filler(4), ...Array<number>(9).fill(0.3)) // filler ends below the centre line
    const flags = rulesAt(run)
    expect(flags[11]).toEqual([]) // eight in a row
    expect(flags[12]).toEqual(['run-one-side'])
    expect(controlChart(run, given).points[12]?.violations[0]?.message).toBe('Points 5–13: 9 in a row above the centre line (10,500.0 J/K), a shift.')
    expect(rulesAt(run, { ...given, runLength: 8 })[11]).toEqual(['run-one-side'])
  })

  it('six in a row steadily increasing or decreasing', () => {
    const up = series(0.5, -0.3, -0.2, -0.1, 0.1, 0.2, 0.3) // the fall from 0.5 starts the count at −0.3
    const flags = rulesAt(up)
    expect(flags[5]).toEqual([]) // five rising
    expect(flags[6]).toEqual(['trend'])
    const down = series(0.3, 0.2, 0.1, -0.1, -0.2, -0.3)
    expect(controlChart(down, given).points[5]?.violations[0]?.message).toBe('Points 1–6: 6 in a row steadily decreasing, a drift.')
    expect(rulesAt(series(0.1, 0.2, 0.2, 0.3, 0.4, 0.5))[5]).toEqual([]) // a tie breaks the trend
  })

  it('a quiet series raises nothing', () => {
    const chart = controlChart(series(...filler(30)), given)
    expect(chart.outOfControl).toBe(false)
    expect(chart.points.every((p) => p.zone === 'inside-warning')).toBe(true)
  })
})
