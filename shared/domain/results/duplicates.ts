// Agreement of replicate determinations against the method's repeatability limit r; never averages blindly.
import { assertFinite, assertPositive, formatNumber } from './guards'
import { mean, median, range } from './statistics'

/**
 * Critical range of n results as a multiple of r: f(n)/f(2) with f(2) = 2.8, f(3) = 3.3, f(4) = 3.6 (ISO 5725-6 §5.2,
 * CR0.95(n) = f(n)·σr and r = 2.8·σr), rounded to 1.2 r and 1.3 r as ISO solid-fuel methods state them (from memory).
 */
export const CRITICAL_RANGE_FACTORS = { 2: 1, 3: 1.2, 4: 1.3 } as const

export type DuplicateStatus =
  | 'needs-duplicate'
  | 'accepted'
  | 'third-determination-needed'
  | 'median-flagged'
  | 'review-needed'

export interface DuplicateOptions {
  /** Repeatability limit r in the unit of the results (ISO 1928: 120 J/g). */
  repeatabilityLimit: number
  /** Unit label for the messages; default 'J/g'. */
  unit?: string
  /** Decimals in the messages; default 0. */
  decimals?: number
}

export interface DuplicateAssessment {
  status: DuplicateStatus
  /** The reportable value, or null while more determinations are needed. */
  value: number | null
  method: 'mean' | 'median' | null
  /** max − min of the results (for two results, their difference); null for fewer than two. */
  range: number | null
  /** The critical range the results were held to; null when no test applies. */
  limit: number | null
  n: number
  message: string
}

/** Judges 1–4 replicates: |a − b| ≤ r → mean, else a third; range of three ≤ 1.2r (four ≤ 1.3r) → mean, else the median, flagged — ISO 5725-6 §5.2 critical-range procedure (ISO 1928 r = 120 J/g). */
export function assessDuplicates(results: readonly number[], options: DuplicateOptions): DuplicateAssessment {
  assertPositive(options.repeatabilityLimit, 'repeatabilityLimit')
  results.forEach((v, i) => assertFinite(v, `results[${i}]`))
  const unit = options.unit ?? 'J/g'
  const dp = options.decimals ?? 0
  const fmt = (v: number) => `${formatNumber(v, dp)} ${unit}`
  const r = options.repeatabilityLimit
  const n = results.length

  if (n < 2) {
    return {
      status: 'needs-duplicate', value: null, method: null, range: null, limit: null, n,
      message: n === 0 ? 'No results yet; two determinations are needed.' : 'One result; a duplicate determination is needed before a value can be reported.',
    }
  }
  if (n > 4) {
    return {
      status: 'review-needed', value: null, method: null, range: range(results), limit: null, n,
      message: `${n} results: the repeatability procedure covers two to four determinations; a supervisor should review the series.`,
    }
  }

  const w = range(results)
  const factor = CRITICAL_RANGE_FACTORS[n as 2 | 3 | 4]
  const limit = factor * r
  // Absorbs the binary rounding of max − min so a difference of exactly r counts as within r.
  const within = w <= limit * (1 + 1e-12)

  if (within) {
    const what = n === 2 ? `The two results differ by ${fmt(w)}` : `The range of the ${n} results is ${fmt(w)}`
    return {
      status: 'accepted', value: mean(results), method: 'mean', range: w, limit, n,
      message: `${what}, within ${fmt(limit)}${n === 2 ? ' (r)' : ` (${factor} r)`}; the mean is reported.`,
    }
  }
  if (n === 2) {
    return {
      status: 'third-determination-needed', value: null, method: null, range: w, limit, n,
      message: `The two results differ by ${fmt(w)}, more than the repeatability limit of ${fmt(limit)}; make a third determination.`,
    }
  }
  return {
    status: 'median-flagged', value: median(results), method: 'median', range: w, limit, n,
    message: `The range of the ${n === 3 ? 'three' : 'four'} results is ${fmt(w)}, more than ${fmt(limit)} (${factor} r); `
      + `the median ${fmt(median(results))} is reported and flagged for review${n === 3 ? ' (a fourth determination may be made)' : ''}.`,
  }
}
