// Standardisation of a vessel's energy equivalent: series statistics, acceptance and the control charts.
import { createHash } from 'node:crypto'
import { and, asc, desc, eq } from 'drizzle-orm'
import { z } from 'zod'
import type { LabPolicy } from '#shared/domain/policy'
import { controlChart, mean, seriesStatistics } from '#shared/domain/results'
import type { ControlChart, SeriesStatistics } from '#shared/domain/results'

export const acceptSeriesSchema = z.object({
  resultIds: z.array(z.string().uuid('a result id (UUID)')).min(2, 'at least two standardisation results').max(50, 'at most 50 results')
    .refine(ids => new Set(ids).size === ids.length, 'each result once'),
  password: z.string().min(1, 'your password signs this').max(1024),
  reason: z.string().trim().min(3, 'say why').max(2000),
}).strict()

export function energyEquivalentView(e: EnergyEquivalentRow, acceptedByName?: string | null) {
  return {
    id: e.id,
    vesselId: e.vesselId,
    valueJPerK: e.valueJPerK,
    standardDeviationJPerK: e.standardDeviationJPerK,
    relativeStandardDeviationPct: e.relativeStandardDeviationPct,
    runs: e.runs,
    resultIds: e.resultIds,
    meanEnergyJ: e.meanEnergyJ,
    acceptedBy: e.acceptedBy,
    acceptedByName: acceptedByName ?? null,
    acceptedAt: e.acceptedAt,
    active: e.active,
  }
}

export async function energyEquivalentHistory(db: Db | Tx, vesselId: string) {
  const rows = await db.select({ e: schema.energyEquivalents, name: schema.users.name }).from(schema.energyEquivalents)
    .innerJoin(schema.users, eq(schema.users.id, schema.energyEquivalents.acceptedBy))
    .where(eq(schema.energyEquivalents.vesselId, vesselId)).orderBy(desc(schema.energyEquivalents.acceptedAt))
  return rows.map(r => energyEquivalentView(r.e, r.name))
}

export function seriesPolicy(policy: LabPolicy) {
  return { minRuns: policy.standardisationRuns, maxRsdPct: policy.standardisationMaxRsdPct }
}

export interface ChartPoint { resultId: string, sampleCode: string, firedAt: Date | null, value: number, zone: string, violations: string[] }
export type ChartView =
  | { ok: true, unit: string, limits: ControlChart['limits'], basis: string, points: ChartPoint[], violations: string[], outOfControl: boolean, band?: { lower: number, upper: number, label: string } }
  | { ok: false, unit: string, reason: string, points: ChartPoint[], band?: { lower: number, upper: number, label: string } }

function chartView(points: { resultId: string, sampleCode: string, firedAt: Date | null, value: number }[], unit: string, baseline: { mean: number, sigma: number, basis: string } | null, band?: { lower: number, upper: number, label: string }): ChartView {
  const plain = points.map(p => ({ ...p, zone: 'inside-warning', violations: [] as string[] }))
  const values = points.map(p => p.value)
  if (!values.length) return { ok: false, unit, reason: 'No points yet.', points: plain, band }
  let basis = baseline?.basis ?? ''
  let options: Parameters<typeof controlChart>[1] = { unit, decimals: unit === 'J/K' ? 1 : 0 }
  if (baseline && baseline.sigma > 0) options = { ...options, baseline: { mean: baseline.mean, sigma: baseline.sigma } }
  else if (values.length >= 2 && new Set(values).size > 1) basis = `limits from the first ${Math.min(values.length, 20)} points (σ from the mean moving range, ISO 7870-2)`
  else return { ok: false, unit, reason: 'At least two different points are needed to draw control limits.', points: plain, band }
  const chart = controlChart(values, options)
  const violations = [...new Set(chart.points.flatMap(p => p.violations.map(v => v.message)))]
  return {
    ok: true, unit, basis, limits: chart.limits, outOfControl: chart.outOfControl, violations, band,
    points: points.map((p, i) => ({ ...p, zone: chart.points[i]!.zone, violations: chart.points[i]!.violations.map(v => v.message) })),
  }
}

/** Everything the standardisation page and the vessel's control chart show for one vessel. */
export async function standardisationDetail(db: Db | Tx, vesselId: string, policy: LabPolicy) {
  const vesselRow = await findVesselOr404(db, vesselId)
  const history = await energyEquivalentHistory(db, vesselId)
  const active = history.find(h => h.active) ?? null
  const rows = await db.select().from(schema.results)
    .where(and(eq(schema.results.vesselId, vesselId), eq(schema.results.current, true)))
    .orderBy(asc(schema.results.createdAt))
  const views = await loadResultViews(db, rows.filter(r => r.kind === 'standardisation' || r.kind === 'check'))
  const byTime = (a: ResultView, b: ResultView) => new Date(a.firedAt ?? a.createdAt).getTime() - new Date(b.firedAt ?? b.createdAt).getTime()
  const standardisations = views.filter(v => v.kind === 'standardisation').sort(byTime)
  const checks = views.filter(v => v.kind === 'check').sort(byTime)
  // Results already in an accepted series, by the series that accepted them.
  const inSeries = new Map<string, string>()
  for (const h of history) for (const id of h.resultIds) inSeries.set(id, h.id)
  const pending = standardisations.filter(s => !inSeries.has(s.id))
  const candidate = pending.slice(-policy.standardisationRuns)
  const candidateStats: SeriesStatistics = seriesStatistics(candidate.map(c => c.values.energyEquivalentJPerK!), seriesPolicy(policy))

  const epsPoints = standardisations.map(s => ({ resultId: s.id, sampleCode: s.sampleCode, firedAt: s.firedAt, value: s.values.energyEquivalentJPerK! }))
  const epsChart = chartView(epsPoints, 'J/K', active && active.standardDeviationJPerK > 0
    ? { mean: active.valueJPerK, sigma: active.standardDeviationJPerK, basis: `centre and σ of the accepted series of ${new Date(active.acceptedAt).toISOString().slice(0, 10)} (${active.runs} runs)` }
    : null)
  const checkPoints = checks.map(c => ({ resultId: c.id, sampleCode: c.sampleCode, firedAt: c.firedAt, value: c.values.grossJPerG['air-dried']! }))
  const certified = checks.length ? mean(checks.map(c => c.values.check?.certifiedJPerG ?? c.values.certifiedValueJPerG ?? 0)) : null
  // A single check determination scatters about as much as the calorimeter's ε does: σ_q/q ≈ RSD(ε) (common practice).
  const checkBaseline = certified && active && active.relativeStandardDeviationPct > 0
    ? { mean: certified, sigma: (certified * active.relativeStandardDeviationPct) / 100, basis: `centre at the certified value; σ = certified value × RSD of the accepted ε (${active.relativeStandardDeviationPct.toFixed(3)} %)` }
    : null
  const tolerance = certified ? { lower: certified * (1 - policy.checkRunTolerancePct / 100), upper: certified * (1 + policy.checkRunTolerancePct / 100), label: `check tolerance ± ${policy.checkRunTolerancePct} %` } : undefined
  const checkChart = chartView(checkPoints, 'J/g', checkBaseline, tolerance)

  return {
    vessel: vesselView(vesselRow, policy),
    policy: { standardisationRuns: policy.standardisationRuns, standardisationMaxRsdPct: policy.standardisationMaxRsdPct, checkRunTolerancePct: policy.checkRunTolerancePct },
    active,
    history,
    standardisations: standardisations.map(s => ({ ...s, seriesId: inSeries.get(s.id) ?? null })),
    checks,
    candidate: { resultIds: candidate.map(c => c.id), statistics: candidateStats },
    charts: { energyEquivalent: epsChart, checks: checkChart },
  }
}

/** Binds the acceptance signature to the results and their ε values. */
export function seriesHash(results: { id: string, revision: number, values: Pick<ResultValues, 'energyEquivalentJPerK'> }[]): string {
  return createHash('sha256').update(JSON.stringify(results.map(r => [r.id, r.revision, r.values.energyEquivalentJPerK]))).digest('hex')
}
