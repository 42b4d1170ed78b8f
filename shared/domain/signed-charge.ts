// What a signature covers at the firing: the weighed charge is compared with the charge as signed.
// Pure rules; the firing service applies them to the stored run and its re-assessment.
import type { Assessment, Finding } from './assessment'

export interface MassExcess {
  signedG: number
  weighedG: number
  /** Weighed above signed, in % of the signed mass (negative when lighter). */
  excessPct: number
  tolerancePct: number
  exceeded: boolean
  /** "weighed 0.94 g, signed 0.90 g: +4.4 % above the 2 % tolerance" */
  words: string
}

const grams = (g: number) => `${g.toLocaleString('en-GB', { minimumFractionDigits: 2, maximumFractionDigits: 4 })} g`
const signedPct = (p: number) => `${p >= 0 ? '+' : '−'}${Math.abs(p).toLocaleString('en-GB', { minimumFractionDigits: 1, maximumFractionDigits: 1 })} %`

/**
 * A signature covers the signed sample mass plus the lab's tolerance (policy, common practice); a heavier sample
 * releases proportionally more heat and needs a new signature. A lighter one is covered.
 */
export function massExcess(signedG: number, weighedG: number, tolerancePct: number): MassExcess {
  const excessPct = signedG > 0 ? ((weighedG - signedG) / signedG) * 100 : Number.POSITIVE_INFINITY
  // Compare with a hair of slack so that a mass exactly at the tolerance (0.918 g on 0.900 g at 2 %) is covered.
  const exceeded = excessPct > tolerancePct + 1e-9
  const words = `weighed ${grams(weighedG)}, signed ${grams(signedG)}: ${signedPct(excessPct)} ${exceeded ? 'above' : 'within'} the ${tolerancePct.toLocaleString('en-GB')} % tolerance`
  return { signedG, weighedG, excessPct, tolerancePct, exceeded, words }
}

function numbers(f: Finding): Map<string, number> {
  return new Map(Object.entries(f.data ?? {}).filter((e): e is [string, number] => typeof e[1] === 'number' && Number.isFinite(e[1])))
}

/** True when a number the finding rests on moved by more than the tolerance (relative), or a number appeared or went. */
export function findingNumbersChanged(before: Finding, after: Finding, tolerancePct: number): boolean {
  const a = numbers(before)
  const b = numbers(after)
  if (a.size !== b.size) return true
  for (const [k, v] of a) {
    const w = b.get(k)
    if (w === undefined) return true
    const scale = Math.max(Math.abs(v), Math.abs(w))
    if (scale > 0 && Math.abs(w - v) / scale > tolerancePct / 100 + 1e-12) return true
  }
  return false
}

export interface FindingChanges {
  /** Block findings the signed charge did not have: the run cannot be fired. */
  blocks: Finding[]
  /** Approval findings that are new, or whose numbers changed beyond the tolerance: a new signature is needed. */
  approvals: Finding[]
}

/**
 * Findings of the weighed charge that the signed (or cleared) charge did not carry. Notes (info) need no action and
 * are left out; a block is new unless the same code was there; an approval is new when its code is new or, for a
 * signed charge, when its numbers moved beyond the tolerance.
 */
export function findingChanges(before: Assessment, after: Assessment, tolerancePct: number, signed: boolean): FindingChanges {
  const byCode = new Map(before.findings.filter(f => f.severity !== 'info').map(f => [`${f.severity}:${f.code}`, f]))
  const blocks = after.findings.filter(f => f.severity === 'block' && !byCode.has(`block:${f.code}`))
  const approvals = after.findings.filter((f) => {
    if (f.severity !== 'approval') return false
    const was = byCode.get(`approval:${f.code}`)
    if (!was) return true
    return signed && findingNumbersChanged(was, f, tolerancePct)
  })
  return { blocks, approvals }
}

/** The sample mass of a charge (all sample components), in g. */
export function sampleMassG(components: readonly { role: string, massG?: number | null }[]): number {
  return components.reduce((sum, c) => sum + (c.role === 'sample' ? c.massG ?? 0 : 0), 0)
}
