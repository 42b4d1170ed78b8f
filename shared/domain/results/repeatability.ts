// The run-to-run scatter of a determination: the lab's own duplicates when there are enough, else the method's r.
import { assertPositive } from './guards'
import { mean } from './statistics'

/** Factor between a limit for two results and the standard deviation: r = 2.8·s_r (2.8 ≈ 1.96·√2) — ISO 5725-6 §4.1.4. */
export const LIMIT_FACTOR = 2.8

/** s_r = r/2.8 — ISO 5725-6. */
export function standardDeviationFromLimit(limit: number): number {
  assertPositive(limit, 'limit')
  return limit / LIMIT_FACTOR
}

/** Pooled s = √(ΣΣ(x − x̄_j)² / Σ(n_j − 1)) over groups of replicates of the same sample — JCGM 100:2008 §H.3.6 / ISO 5725-2. */
export function pooledStandardDeviation(groups: readonly (readonly number[])[]): { standardDeviation: number, degreesOfFreedom: number } | null {
  let ss = 0
  let dof = 0
  for (const g of groups) {
    if (g.length < 2) continue
    const m = mean(g)
    for (const x of g) ss += (x - m) ** 2
    dof += g.length - 1
  }
  return dof > 0 ? { standardDeviation: Math.sqrt(ss / dof), degreesOfFreedom: dof } : null
}

export interface RepeatabilityTerm {
  standardDeviationJPerG: number
  source: 'lab-duplicates' | 'method-limit'
  degreesOfFreedom: number | null
  /** Plain words for the budget table. */
  basis: string
}

/**
 * The lab's pooled s_r once it rests on at least minDegreesOfFreedom and is not below the method's, else r/2.8 of the
 * method (ISO 5725-6). A lab scattering less than the method allows does not report a single determination with a U
 * below 2·r/2.8: the method's repeatability is the floor (the lab's own decision, kept conservative).
 */
export function repeatabilityTerm(limitJPerG: number, own: { standardDeviation: number, degreesOfFreedom: number } | null, minDegreesOfFreedom: number): RepeatabilityTerm {
  const method = standardDeviationFromLimit(limitJPerG)
  if (own && own.degreesOfFreedom >= minDegreesOfFreedom && own.standardDeviation >= method) {
    return { standardDeviationJPerG: own.standardDeviation, source: 'lab-duplicates', degreesOfFreedom: own.degreesOfFreedom, basis: `the lab's own duplicates (${own.degreesOfFreedom} degrees of freedom)` }
  }
  const ownWords = own && own.degreesOfFreedom >= minDegreesOfFreedom
    ? `; the lab's own duplicates (s = ${Math.round(own.standardDeviation * 10) / 10} J/g) do not lower it`
    : ''
  return { standardDeviationJPerG: method, source: 'method-limit', degreesOfFreedom: null, basis: `r/2.8 with r = ${limitJPerG} J/g (ISO 5725-6)${ownWords}` }
}
