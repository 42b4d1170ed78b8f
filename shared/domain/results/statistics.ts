// Plain descriptive statistics shared by the results modules (no dependencies, no mutation of inputs).

/** Arithmetic mean q̄ = Σq_k / n — JCGM 100:2008 §4.2.1, eq. (3). */
export function mean(values: readonly number[]): number {
  if (values.length === 0) throw new RangeError('mean of an empty series')
  let sum = 0
  for (const v of values) sum += v
  return sum / values.length
}

/** Experimental (sample) standard deviation s = √(Σ(q_k − q̄)²/(n − 1)) — JCGM 100:2008 §4.2.2, eq. (4). */
export function sampleStandardDeviation(values: readonly number[]): number {
  if (values.length < 2) throw new RangeError('a standard deviation needs at least two values')
  const m = mean(values)
  let sumSq = 0
  for (const v of values) sumSq += (v - m) ** 2
  return Math.sqrt(sumSq / (values.length - 1))
}

/** Median: middle value of the sorted series, mean of the two middle values when n is even — ISO 5725-6 §5.2 (median as the robust alternative to the mean). */
export function median(values: readonly number[]): number {
  if (values.length === 0) throw new RangeError('median of an empty series')
  const sorted = [...values].sort((a, b) => a - b)
  const mid = Math.floor(sorted.length / 2)
  const upper = sorted[mid] as number
  return sorted.length % 2 === 1 ? upper : ((sorted[mid - 1] as number) + upper) / 2
}

/** Range w = max − min — ISO 5725-6 §5.2 (range used for the critical-range test). */
export function range(values: readonly number[]): number {
  if (values.length === 0) throw new RangeError('range of an empty series')
  // A loop, not Math.max(...values): spreading a long series overflows the call stack.
  let lo = Infinity
  let hi = -Infinity
  for (const v of values) {
    if (v < lo) lo = v
    if (v > hi) hi = v
  }
  return hi - lo
}

/** Least-squares straight line T = intercept + slope·t — ordinary linear regression (textbook normal equations). */
export function linearFit(xs: readonly number[], ys: readonly number[]): { slope: number; intercept: number } {
  if (xs.length !== ys.length) throw new RangeError('x and y must have the same length')
  if (xs.length < 2) throw new RangeError('a line needs at least two points')
  const mx = mean(xs)
  const my = mean(ys)
  let sxy = 0
  let sxx = 0
  for (let i = 0; i < xs.length; i++) {
    const dx = (xs[i] as number) - mx
    sxy += dx * ((ys[i] as number) - my)
    sxx += dx * dx
  }
  if (sxx === 0) throw new RangeError('a line needs at least two distinct x values')
  const slope = sxy / sxx
  return { slope, intercept: my - slope * mx }
}
