// Shewhart chart for individual values (ε per vessel, check-standard results) with warning/action limits and run rules.
import { assertFinite, assertPositive, formatNumber } from './guards'
import { mean, sampleStandardDeviation } from './statistics'

export type ControlRule = 'beyond-action-limit' | 'two-of-three-beyond-warning' | 'run-one-side' | 'trend'

/** d2 for moving ranges of two, E|x₁ − x₂| = d2·σ with d2 = 2/√π ≈ 1.128 — ISO 7870-2 (table of control-chart constants). */
export const MOVING_RANGE_D2 = 2 / Math.sqrt(Math.PI)

/** Default run length for a shift: nine in a row on one side — ISO 7870-2 test 2 (Western Electric handbook 1956 uses eight). */
export const DEFAULT_RUN_LENGTH = 9

/** Default trend length: six in a row steadily increasing or decreasing — ISO 7870-2 test 3. */
export const DEFAULT_TREND_LENGTH = 6

/** Default number of leading points that set the limits; ISO 7870-2 asks for about 20–25 (from memory). */
export const DEFAULT_BASELINE_POINTS = 20

export type ControlBaseline = { points: number } | { mean: number; sigma: number }

export interface ControlChartOptions {
  /** Limits from the first n points, or from a given mean and σ; default the first 20 points (or all, if fewer). */
  baseline?: ControlBaseline
  /** σ from the mean moving range / d2 (default) or from the sample standard deviation of the baseline. */
  sigmaEstimate?: 'moving-range' | 'standard-deviation'
  runLength?: number
  trendLength?: number
  /** Unit label for messages, e.g. 'J/K'. */
  unit?: string
  /** Decimals in messages; default 1. */
  decimals?: number
}

export interface ControlLimits {
  centre: number
  sigma: number
  upperWarning: number
  lowerWarning: number
  upperAction: number
  lowerAction: number
  /** Number of baseline points used; null when mean and σ were given. */
  baselinePoints: number | null
  sigmaEstimate: 'moving-range' | 'standard-deviation' | 'given'
}

export interface ControlViolation {
  rule: ControlRule
  message: string
  /** Indices (0-based) of the points that make up the pattern, ending with this point. */
  indices: number[]
}

export interface ControlChartPoint {
  index: number
  value: number
  zone: 'inside-warning' | 'beyond-warning' | 'beyond-action'
  violations: ControlViolation[]
}

export interface ControlChart {
  limits: ControlLimits
  points: ControlChartPoint[]
  outOfControl: boolean
}

/** Centre line and ±2σ warning / ±3σ action limits; σ = mean moving range/d2 or the sample standard deviation — ISO 7870-2 (individuals chart); ISO 7870-2 / Western Electric handbook 1956 for 2σ and 3σ. */
export function controlLimits(values: readonly number[], options: ControlChartOptions = {}): ControlLimits {
  values.forEach((v, i) => assertFinite(v, `values[${i}]`))
  const baseline = options.baseline ?? { points: Math.min(values.length, DEFAULT_BASELINE_POINTS) }
  let centre: number
  let sigma: number
  let baselinePoints: number | null = null
  let sigmaEstimate: ControlLimits['sigmaEstimate'] = 'given'
  if ('mean' in baseline) {
    assertFinite(baseline.mean, 'baseline.mean')
    assertPositive(baseline.sigma, 'baseline.sigma')
    centre = baseline.mean
    sigma = baseline.sigma
  } else {
    const n = baseline.points
    if (!Number.isInteger(n) || n < 2) throw new RangeError('the baseline needs at least two points')
    if (n > values.length) throw new RangeError(`the baseline asks for ${n} points but the series has ${values.length}`)
    const base = values.slice(0, n)
    centre = mean(base)
    sigmaEstimate = options.sigmaEstimate ?? 'moving-range'
    if (sigmaEstimate === 'moving-range') {
      const ranges = base.slice(1).map((v, i) => Math.abs(v - (base[i] as number)))
      sigma = mean(ranges) / MOVING_RANGE_D2
    } else {
      sigma = sampleStandardDeviation(base)
    }
    baselinePoints = n
    if (!(sigma > 0)) throw new RangeError('the baseline points are all equal, so σ is zero; give a mean and σ instead')
  }
  return {
    centre,
    sigma,
    upperWarning: centre + 2 * sigma,
    lowerWarning: centre - 2 * sigma,
    upperAction: centre + 3 * sigma,
    lowerAction: centre - 3 * sigma,
    baselinePoints,
    sigmaEstimate,
  }
}

/** Flags each point by the rules: 1 beyond 3σ; 2 of 3 beyond the same 2σ; a run of 9 on one side; 6 steadily rising or falling — ISO 7870-2 tests 1, 5, 2, 3; Western Electric Statistical Quality Control Handbook (1956) rules 1, 2. */
export function controlChart(values: readonly number[], options: ControlChartOptions = {}): ControlChart {
  const limits = controlLimits(values, options)
  const runLength = options.runLength ?? DEFAULT_RUN_LENGTH
  const trendLength = options.trendLength ?? DEFAULT_TREND_LENGTH
  if (!Number.isInteger(runLength) || runLength < 2) throw new RangeError('runLength must be an integer of at least 2')
  if (!Number.isInteger(trendLength) || trendLength < 3) throw new RangeError('trendLength must be an integer of at least 3')
  const unit = options.unit ? ` ${options.unit}` : ''
  const fmt = (v: number) => `${formatNumber(v, options.decimals ?? 1)}${unit}`
  const { centre, sigma } = limits
  const at = (i: number) => values[i] as number
  const z = (i: number) => (at(i) - centre) / sigma
  const span = (from: number, to: number) => Array.from({ length: to - from + 1 }, (_, k) => from + k)
  const label = (from: number, to: number) => `Points ${from + 1}–${to + 1}`

  const points: ControlChartPoint[] = values.map((value, i) => {
    const zi = Math.abs(z(i))
    const violations: ControlViolation[] = []

    if (zi > 3) {
      const upper = z(i) > 0
      violations.push({
        rule: 'beyond-action-limit',
        indices: [i],
        message: `Point ${i + 1} (${fmt(value)}) lies ${upper ? 'above the upper' : 'below the lower'} action limit `
          + `(${fmt(upper ? limits.upperAction : limits.lowerAction)}, ${upper ? '+' : '−'}3σ).`,
      })
    }

    if (zi > 2 && i >= 1) {
      const side = Math.sign(z(i))
      const from = Math.max(0, i - 2)
      const beyond = span(from, i).filter((j) => Math.sign(z(j)) === side && Math.abs(z(j)) > 2)
      if (beyond.length >= 2) {
        violations.push({
          rule: 'two-of-three-beyond-warning',
          indices: span(from, i),
          message: `${label(from, i)}: ${beyond.length} of ${i - from + 1} lie beyond the ${side > 0 ? 'upper' : 'lower'} warning limit `
            + `(${fmt(side > 0 ? limits.upperWarning : limits.lowerWarning)}, ${side > 0 ? '+' : '−'}2σ).`,
        })
      }
    }

    if (i >= runLength - 1) {
      const from = i - runLength + 1
      const side = Math.sign(z(i))
      if (side !== 0 && span(from, i).every((j) => Math.sign(z(j)) === side)) {
        violations.push({
          rule: 'run-one-side',
          indices: span(from, i),
          message: `${label(from, i)}: ${runLength} in a row ${side > 0 ? 'above' : 'below'} the centre line (${fmt(centre)}), a shift.`,
        })
      }
    }

    if (i >= trendLength - 1) {
      const from = i - trendLength + 1
      const steps = span(from + 1, i)
      const rising = steps.every((j) => at(j) > at(j - 1))
      const falling = steps.every((j) => at(j) < at(j - 1))
      if (rising || falling) {
        violations.push({
          rule: 'trend',
          indices: span(from, i),
          message: `${label(from, i)}: ${trendLength} in a row steadily ${rising ? 'increasing' : 'decreasing'}, a drift.`,
        })
      }
    }

    const zone: ControlChartPoint['zone'] = zi > 3 ? 'beyond-action' : zi > 2 ? 'beyond-warning' : 'inside-warning'
    return { index: i, value, zone, violations }
  })

  return { limits, points, outOfControl: points.some((p) => p.violations.length > 0) }
}
