// Energy equivalent of the calorimeter from benzoic-acid standardisation runs, and the acceptance of a series.
import { assertFinite, assertNonNegative, assertPositive, formatNumber } from './guards'
import { mean, sampleStandardDeviation } from './statistics'

/** One standardisation firing: certified benzoic acid plus the heat of the fuse, acid and any aid, all in joules. */
export interface StandardisationRun {
  /** Mass of benzoic acid burnt, g (mass in vacuum when benzoicAcidJPerG is the in-vacuum certificate value). */
  benzoicAcidMassG: number
  /** Certified specific energy of combustion, J/g (e.g. 26 434 J/g, NIST SRM 39j, mass in vacuum). */
  benzoicAcidJPerG: number
  /** Corrected temperature rise θ, K. */
  temperatureRiseK: number
  fuseJ?: number
  acidJ?: number
  aidJ?: number
}

/** Acceptance rule for a standardisation series (lab policy; e.g. ISO 1928 five runs, ASTM D240 at least six). */
export interface SeriesPolicy {
  minRuns: number
  /** Largest acceptable relative standard deviation of the series, %. */
  maxRsdPct: number
}

export interface SeriesStatistics {
  n: number
  mean: number | null
  /** Sample standard deviation (n − 1); null below two values. */
  standardDeviation: number | null
  relativeStandardDeviationPct: number | null
  accepted: boolean
  /** Plain sentence(s) saying why the series is not accepted; null when accepted. */
  reason: string | null
}

/** ε (J/K) = (m_BA·q_BA + e_fuse + e_acid + e_aid)/θ — ASTM D240 §8; ISO 1928. */
export function energyEquivalent(run: StandardisationRun): number {
  assertPositive(run.benzoicAcidMassG, 'benzoicAcidMassG')
  assertPositive(run.benzoicAcidJPerG, 'benzoicAcidJPerG')
  assertPositive(run.temperatureRiseK, 'temperatureRiseK')
  const fuse = run.fuseJ ?? 0
  const acid = run.acidJ ?? 0
  const aid = run.aidJ ?? 0
  assertNonNegative(fuse, 'fuseJ')
  assertNonNegative(acid, 'acidJ')
  assertNonNegative(aid, 'aidJ')
  return (run.benzoicAcidMassG * run.benzoicAcidJPerG + fuse + acid + aid) / run.temperatureRiseK
}

/** Mean, sample standard deviation and RSD % = 100·s/x̄ of a series, judged against minRuns and maxRsdPct — JCGM 100:2008 §4.2 (s), ISO 1928 / ASTM D240 (acceptance by policy). */
export function seriesStatistics(values: readonly number[], policy: SeriesPolicy): SeriesStatistics {
  if (!Number.isInteger(policy.minRuns) || policy.minRuns < 2) throw new RangeError('minRuns must be an integer of at least 2')
  assertPositive(policy.maxRsdPct, 'maxRsdPct')
  values.forEach((v, i) => assertFinite(v, `values[${i}]`))

  const n = values.length
  const m = n > 0 ? mean(values) : null
  const s = n >= 2 ? sampleStandardDeviation(values) : null
  const rsd = m !== null && s !== null && m !== 0 ? (100 * s) / Math.abs(m) : null

  const reasons: string[] = []
  if (n < policy.minRuns) reasons.push(`Only ${n} run${n === 1 ? '' : 's'}; the method needs at least ${policy.minRuns}.`)
  if (rsd !== null && rsd > policy.maxRsdPct) {
    reasons.push(`The relative standard deviation is ${formatNumber(rsd, 3)} %, above the limit of ${formatNumber(policy.maxRsdPct, 3)} %.`)
  }
  return {
    n,
    mean: m,
    standardDeviation: s,
    relativeStandardDeviationPct: rsd,
    accepted: reasons.length === 0,
    reason: reasons.length === 0 ? null : reasons.join(' '),
  }
}
