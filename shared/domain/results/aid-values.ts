// The lab's own determination of an aid's heating value (capsule, tape, oil, cotton): a small series like a standardisation.
import { assertFinite, assertPositive } from './guards'
import { mean, sampleStandardDeviation } from './statistics'
import { standardUncertaintyOfMean } from './uncertainty'

export const AID_KINDS = ['capsule', 'tape', 'oil', 'cotton', 'other'] as const
export type AidKind = (typeof AID_KINDS)[number]
export const AID_KIND_LABELS: Readonly<Record<AidKind, string>> = { capsule: 'Capsule', tape: 'Tape', oil: 'Oil', cotton: 'Cotton thread (fuse)', other: 'Other aid' }

/** Fewest determinations in a series (common practice: three, so that a standard deviation means something). */
export const AID_SERIES_MIN_RUNS = 3
/** Largest relative standard deviation accepted, % (common practice: aids scatter more than benzoic acid). */
export const AID_SERIES_MAX_RSD_PCT = 1

export interface AidSeries { n: number, meanJPerG: number, standardDeviationJPerG: number, standardUncertaintyJPerG: number, rsdPct: number, accepted: boolean, reason: string | null }

/** Mean, s and u = s/√n of a series of determinations — JCGM 100:2008 §4.2.3; accepted at ≥ 3 runs and RSD ≤ 1 % (common practice). */
export function aidSeries(valuesJPerG: readonly number[]): AidSeries {
  valuesJPerG.forEach((v, i) => { assertFinite(v, `determinationsJPerG[${i}]`); assertPositive(v, `determinationsJPerG[${i}]`) })
  const n = valuesJPerG.length
  if (n < 2) return { n, meanJPerG: n ? mean(valuesJPerG) : 0, standardDeviationJPerG: 0, standardUncertaintyJPerG: 0, rsdPct: 0, accepted: false, reason: `At least ${AID_SERIES_MIN_RUNS} determinations are needed.` }
  const m = mean(valuesJPerG)
  const s = sampleStandardDeviation(valuesJPerG)
  const rsd = (100 * s) / m
  const reasons = [
    n < AID_SERIES_MIN_RUNS ? `Only ${n} determinations; at least ${AID_SERIES_MIN_RUNS} are needed.` : '',
    rsd > AID_SERIES_MAX_RSD_PCT ? `The relative standard deviation is ${rsd.toFixed(2)} %, above ${AID_SERIES_MAX_RSD_PCT} %.` : '',
  ].filter(Boolean)
  return { n, meanJPerG: m, standardDeviationJPerG: s, standardUncertaintyJPerG: standardUncertaintyOfMean(s, n), rsdPct: rsd, accepted: !reasons.length, reason: reasons.length ? reasons.join(' ') : null }
}

/** A typical range used as a rectangular distribution: midpoint, u = (max − min)/(2√3) — JCGM 100:2008 §4.3.7. */
export function typicalRangeValue(minJPerG: number, maxJPerG: number): { valueJPerG: number, standardUncertaintyJPerG: number } {
  assertPositive(minJPerG, 'minJPerG')
  if (!(maxJPerG >= minJPerG)) throw new RangeError('the range maximum must not be below its minimum')
  return { valueJPerG: (minJPerG + maxJPerG) / 2, standardUncertaintyJPerG: (maxJPerG - minJPerG) / (2 * Math.sqrt(3)) }
}
