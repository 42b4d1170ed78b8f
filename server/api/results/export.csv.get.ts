import { desc } from 'drizzle-orm'

const COLUMNS = [
  'result_id', 'revision', 'current', 'sample_code', 'kind', 'vessel', 'fired_at_utc', 'fired_by', 'sample_mass_g', 'temperature_rise_k', 'theta_source',
  'energy_equivalent_j_per_k', 'fuse_j', 'acid_j', 'sulfur_j', 'aid_j',
  'gross_ad_j_per_g', 'gross_dry_j_per_g', 'gross_ar_j_per_g', 'gross_daf_j_per_g', 'net_p_ar_j_per_g', 'net_v_ar_j_per_g', 'net_p_dry_j_per_g',
  'expanded_uncertainty_k2_j_per_g', 'run_energy_equivalent_j_per_k', 'check_deviation_pct', 'duplicate_status', 'status', 'signed_by', 'signed_at_utc', 'revision_reason',
]

/** RFC 4180 field; a leading = + - @ gets a ' so a spreadsheet shows it as text (OWASP, CSV injection). */
function csvField(value: string | number | boolean | null | undefined): string {
  if (value === null || value === undefined) return ''
  let s = typeof value === 'number' ? (Number.isFinite(value) ? String(value) : '') : String(value)
  if (typeof value === 'string' && /^[=+\-@\t\r]/.test(s)) s = `'${s}`
  return /[",\r\n]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s
}
const r2 = (v: number | null | undefined, d: number) => (typeof v === 'number' ? Number(v.toFixed(d)) : null)

// The results list as a spreadsheet-safe CSV (same filters as GET /api/results), values in J/g as computed.
export default defineEventHandler(async (event) => {
  await requireRole(event, 'analyst', 'supervisor')
  const q = parseQuery(event, resultListQuery)
  const db = useDb()
  const rows = await db.select().from(schema.results).where(resultListWhere(q)).orderBy(desc(schema.results.createdAt)).limit(q.limit)
  const views = await loadResultViews(db, rows)
  const duplicates = await duplicateSummaries(db, rows.filter(x => x.kind === 'sample').map(x => x.sampleCode), await getPolicy())
  const lines = views.map((v) => {
    const x = v.values
    return [
      v.id, v.revision, v.current, v.sampleCode, v.kind, v.vesselName, v.firedAt ? new Date(v.firedAt).toISOString() : null, v.firedByName,
      x.sampleMassG, r2(x.temperatureRiseK, 5), x.temperatureRiseSource, r2(x.energyEquivalent?.valueJPerK, 2),
      r2(x.corrections.fuseJ, 2), r2(x.corrections.acidJ, 2), r2(x.corrections.sulfurJ, 2), r2(x.corrections.aidJ, 2),
      r2(x.grossJPerG['air-dried'], 1), r2(x.grossJPerG.dry, 1), r2(x.grossJPerG['as-received'], 1), r2(x.grossJPerG['dry-ash-free'], 1),
      r2(x.netConstantPressureJPerG['as-received'], 1), r2(x.netConstantVolumeJPerG['as-received'], 1), r2(x.netConstantPressureJPerG.dry, 1),
      r2(x.uncertainty?.expandedUncertaintyJPerG, 1), r2(x.energyEquivalentJPerK, 2), r2(x.check?.deviationPct, 4),
      v.kind === 'sample' ? duplicates[v.sampleCode]?.status ?? null : null,
      v.status, v.signature?.signerName ?? null, v.signature ? new Date(v.signature.signedAt).toISOString() : null, v.reason,
    ].map(csvField).join(',')
  })
  const stamp = new Date().toISOString().slice(0, 10).replace(/-/g, '')
  setResponseHeaders(event, {
    'Content-Type': 'text/csv; charset=utf-8',
    'Content-Disposition': `attachment; filename="emberline-results-${stamp}.csv"`,
    'Cache-Control': 'no-store',
  })
  // The byte-order mark lets spreadsheet programs read the names as UTF-8.
  return `\uFEFF${COLUMNS.join(',')}\r\n${lines.map(l => `${l}\r\n`).join('')}`
})
