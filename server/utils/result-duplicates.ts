// Agreement of the determinations of one sample, the value that may be reported, and the lab's own repeatability.
import { and, asc, desc, eq, inArray } from 'drizzle-orm'
import type { LabPolicy } from '../../shared/domain/policy'
import { assessDuplicates, BASES, mean, median, pooledStandardDeviation } from '../../shared/domain/results'
import type { ByBasis, DuplicateAssessment, ResultValues } from '../../shared/domain/results'

export interface DuplicateSummary extends DuplicateAssessment {
  sampleCode: string
  resultIds: string[]
  signed: boolean
  /** Why a value is provisional (typical aid values in any determination); empty when none. */
  provisional: string[]
  /** The reportable value on each basis (mean or median of the determinations), when one may be reported. */
  reported: {
    grossJPerG: ByBasis, netConstantPressureJPerG: ByBasis, netConstantVolumeJPerG: ByBasis, expandedUncertaintyJPerG: number | null
    expandedUncertaintyByBasis: { gross: ByBasis, netConstantPressure: ByBasis, netConstantVolume: ByBasis } | null
    mineralMatterFreeDryJPerG: number | null
  }
}

function combine(values: ResultValues[], pick: (v: ResultValues) => ByBasis, how: 'mean' | 'median' | null): ByBasis {
  const out: ByBasis = {}
  if (!how) return out
  for (const basis of BASES) {
    const xs = values.map(v => pick(v)[basis])
    if (xs.every((x): x is number => typeof x === 'number')) out[basis] = how === 'mean' ? mean(xs) : median(xs)
  }
  return out
}

/**
 * U of the reported value: the largest single-determination budget with its repeatability term divided by √n (the mean of
 * n determinations scatters less; ε, θ, the corrections and the standard do not average out) — JCGM 100:2008 §4.2.3.
 */
function reportedFactor(values: ResultValues[]): number {
  const worst = values.reduce<ResultValues | null>((w, v) => (!w || (v.uncertainty?.combinedStandardUncertaintyJPerG ?? 0) > (w.uncertainty?.combinedStandardUncertaintyJPerG ?? 0) ? v : w), null)
  const uc = worst?.uncertainty?.combinedStandardUncertaintyJPerG
  const sr = worst?.repeatabilityJPerG ?? 0
  if (!uc) return 1
  const n = values.length
  return Math.sqrt(Math.max(uc ** 2 - sr ** 2 + sr ** 2 / n, (sr ** 2) / n)) / uc
}

function scaled(values: ResultValues[], pick: (v: NonNullable<ResultValues['expandedUncertaintyByBasis']>) => ByBasis, factor: number): ByBasis {
  const out: ByBasis = {}
  for (const basis of BASES) {
    const us = values.map(v => (v.expandedUncertaintyByBasis ? pick(v.expandedUncertaintyByBasis)[basis] : undefined))
    if (us.every((x): x is number => typeof x === 'number')) out[basis] = Math.max(...us) * factor
  }
  return out
}

/** Agreement of the current sample determinations of one sample code (ISO 1928 r, via assessDuplicates); never averaged blindly. */
export function duplicateSummary(sampleCode: string, rows: ResultRow[], policy: LabPolicy): DuplicateSummary {
  const current = rows.filter(r => r.current && r.kind === 'sample' && r.sampleCode === sampleCode)
  const values = current.map(r => r.values)
  const a = assessDuplicates(values.map(v => v.grossJPerG['air-dried']!), { repeatabilityLimit: policy.repeatabilityJPerG })
  // A single determination is reported only where the lab's policy allows it.
  const how = a.status === 'accepted' ? 'mean' : a.status === 'median-flagged' ? 'median' : a.n === 1 && policy.singleDeterminationCertificates ? 'mean' : null
  const factor = how ? reportedFactor(values) : 1
  const withBudget = values.filter(v => v.uncertainty)
  const gross = combine(values, v => v.grossJPerG, how)
  const mmf = how && values.every(v => v.mineralMatterFree) ? (how === 'mean' ? mean : median)(values.map(v => v.mineralMatterFree!.dryJPerG)) : null
  return {
    ...a,
    sampleCode,
    resultIds: current.map(r => r.id),
    signed: current.length > 0 && current.every(r => r.status === 'signed'),
    provisional: [...new Set(values.flatMap(v => v.provisional ?? []))],
    reported: {
      grossJPerG: gross,
      netConstantPressureJPerG: combine(values, v => v.netConstantPressureJPerG, how),
      netConstantVolumeJPerG: combine(values, v => v.netConstantVolumeJPerG, how),
      expandedUncertaintyJPerG: how && withBudget.length ? Math.max(...withBudget.map(v => v.uncertainty!.expandedUncertaintyJPerG)) * factor : null,
      expandedUncertaintyByBasis: how && withBudget.length === values.length && values.every(v => v.expandedUncertaintyByBasis)
        ? { gross: scaled(values, e => e.gross, factor), netConstantPressure: scaled(values, e => e.netConstantPressure, factor), netConstantVolume: scaled(values, e => e.netConstantVolume, factor) }
        : null,
      mineralMatterFreeDryJPerG: mmf,
    },
  }
}

/** Duplicate summaries for the sample codes given, from every current sample result of those codes. */
export async function duplicateSummaries(db: Db | Tx, sampleCodes: string[], policy: LabPolicy): Promise<Record<string, DuplicateSummary>> {
  const codes = [...new Set(sampleCodes)]
  if (!codes.length) return {}
  const rows = await db.select().from(schema.results)
    .where(and(inArray(schema.results.sampleCode, codes), eq(schema.results.current, true), eq(schema.results.kind, 'sample')))
    .orderBy(asc(schema.results.createdAt))
  return Object.fromEntries(codes.map(c => [c, duplicateSummary(c, rows, policy)]))
}

/** Pooled s_r of the lab's own replicate determinations (the latest 500 current sample results, grouped by sample code). */
export async function labRepeatability(db: Db | Tx) {
  const rows = await db.select({ sampleCode: schema.results.sampleCode, values: schema.results.values }).from(schema.results)
    .where(and(eq(schema.results.current, true), eq(schema.results.kind, 'sample'))).orderBy(desc(schema.results.createdAt)).limit(500)
  const groups = new Map<string, number[]>()
  for (const r of rows) {
    const v = r.values.grossJPerG?.['air-dried']
    if (typeof v === 'number') groups.set(r.sampleCode, [...(groups.get(r.sampleCode) ?? []), v])
  }
  return pooledStandardDeviation([...groups.values()])
}
