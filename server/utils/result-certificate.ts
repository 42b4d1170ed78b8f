// The content of a certificate of analysis for one sample, from its signed, agreeing determinations.
import { and, asc, desc, eq } from 'drizzle-orm'
import { ACID_CONVENTION_TEXT } from '../../shared/domain/results'
import type { Basis, ByBasis } from '../../shared/domain/results'
import type { CertificateContent, CertificateRow } from './certificate'

const round = (v: number, d: number) => Math.round(v * 10 ** d) / 10 ** d
const BASIS_LABEL: Record<Basis, string> = { 'as-received': 'as received', 'air-dried': 'as determined', 'dry': 'dry', 'dry-ash-free': 'dry, ash-free' }
const BASIS_ORDER: Basis[] = ['as-received', 'air-dried', 'dry', 'dry-ash-free']

/**
 * The content of a certificate for one sample: only when every current determination is signed off and the
 * determinations agree (or a flagged median, or a single one where the lab's policy allows it — said so prominently). 409 otherwise.
 */
export async function certificateContent(db: Db | Tx, sampleCode: string, issuer: { name: string }): Promise<{ content: CertificateContent, resultIds: string[] }> {
  const { labName, policy } = await getLabSettings()
  const rows = await db.select().from(schema.results)
    .where(and(eq(schema.results.sampleCode, sampleCode), eq(schema.results.current, true), eq(schema.results.kind, 'sample')))
    .orderBy(asc(schema.results.createdAt))
  if (!rows.length) throw createError({ statusCode: 404, message: `There are no sample results for ${sampleCode}.` })
  const unsigned = rows.filter(r => r.status !== 'signed')
  if (unsigned.length) {
    throw createError({ statusCode: 409, message: `Only signed results can be certified: ${unsigned.length} of the ${rows.length} current results of ${sampleCode} are not signed off yet.`, data: { unsigned: unsigned.map(r => r.id) } })
  }
  const dup = duplicateSummary(sampleCode, rows, policy)
  if (dup.status === 'third-determination-needed' || dup.status === 'review-needed') {
    throw createError({ statusCode: 409, message: `${dup.message} A certificate is issued once the determinations agree.`, data: { duplicate: dup } })
  }
  if (dup.n === 1 && !policy.singleDeterminationCertificates) {
    throw createError({ statusCode: 409, message: `${sampleCode} has a single determination: the lab's policy issues certificates from agreeing duplicate determinations only. Fire and sign off a duplicate first.`, data: { duplicate: dup, reason: 'duplicate-needed' } })
  }
  const views = await loadResultViews(db, rows)
  const run = await findRunOr404(db, rows[0]!.runId)
  const sample = run.components.find(c => c.role === 'sample')
  let description = sample?.name ?? null
  if (sample?.materialId) {
    const [m] = await db.select({ name: schema.materials.name }).from(schema.materials).where(eq(schema.materials.id, sample.materialId))
    description = m?.name ?? description
  }
  const first = views[0]!.values
  const uBy = dup.reported.expandedUncertaintyByBasis
  const certRows: CertificateRow[] = []
  const add = (quantity: string, values: ByBasis, us: ByBasis | undefined) => {
    for (const b of BASIS_ORDER) {
      const v = values[b]
      if (v !== undefined) certRows.push({ quantity, basis: BASIS_LABEL[b], valueJPerG: v, expandedUncertaintyJPerG: us?.[b] ?? (b === 'air-dried' ? dup.reported.expandedUncertaintyJPerG : null) })
    }
  }
  add('Gross calorific value at constant volume', dup.reported.grossJPerG, uBy?.gross)
  add('Net calorific value at constant pressure', dup.reported.netConstantPressureJPerG, uBy?.netConstantPressure ?? {})
  add('Net calorific value at constant volume', dup.reported.netConstantVolumeJPerG, uBy?.netConstantVolume ?? {})
  if (dup.reported.mineralMatterFreeDryJPerG !== null) certRows.push({ quantity: 'Gross calorific value, mineral-matter-free (ASTM D388)', basis: 'dry, mineral-matter-free', valueJPerG: dup.reported.mineralMatterFreeDryJPerG, expandedUncertaintyJPerG: null })
  const a = first.analysis
  const analysis = [
    a.moistureAdPct !== null && { label: 'moisture of the analysis sample', value: `${a.moistureAdPct} %` },
    a.moistureArPct !== null && { label: 'total moisture as received', value: `${a.moistureArPct} %` },
    a.ashDryPct !== null && { label: 'ash (dry)', value: `${round(a.ashDryPct, 2)} %` },
    a.hydrogenDryPct !== null && { label: 'hydrogen (dry)', value: `${round(a.hydrogenDryPct, 2)} %` },
    a.oxygenDryPct !== null && { label: 'oxygen (dry)', value: `${round(a.oxygenDryPct, 2)} %` },
    a.nitrogenDryPct !== null && { label: 'nitrogen (dry)', value: `${round(a.nitrogenDryPct, 2)} %` },
  ].filter((x): x is { label: string, value: string } => !!x)
  const fired = views.map(v => v.firedAt).filter((d): d is Date => !!d).map(d => new Date(d).toISOString()).sort()
  const [previous] = await db.select({ reportNumber: schema.reports.reportNumber }).from(schema.reports).where(eq(schema.reports.sampleCode, sampleCode)).orderBy(desc(schema.reports.issuedAt)).limit(1)
  const reportedAs = dup.method === 'median' ? 'the median of the determinations, flagged for review' : dup.n === 1 ? 'a SINGLE determination (no duplicate), as the lab\'s policy allows' : `the mean of ${dup.n} determinations`
  const ee = first.energyEquivalent
  const conventions = [...new Set(views.map(v => v.values.corrections.acidConvention).filter(Boolean))]
  const notices = [
    ...(dup.n === 1 ? ['SINGLE DETERMINATION: this value rests on one determination without a duplicate, as the laboratory\'s policy allows; its repeatability has not been confirmed for this sample.'] : []),
    ...(dup.provisional.length ? ['PROVISIONAL: a typical value was used where the laboratory\'s own determination is required.', ...dup.provisional] : []),
  ]
  return {
    resultIds: rows.map(r => r.id),
    content: {
      labName,
      sampleCode,
      sampleDescription: description,
      method: [
        'Gross calorific value at constant volume by combustion in an oxygen-pressurised vessel in a calorimeter calibrated with certified benzoic acid (ISO 1928; ASTM D5865).',
        'Net calorific values by ISO 1928 / ISO 18125; bases by ASTM D3180 / ISO 1170.',
        ee ? `Energy equivalent ${fmtFixed(ee.valueJPerK, 1)} J/K (accepted ${ee.acceptedAt?.slice(0, 10) ?? '—'}).` : '',
        ...conventions.map(c => `Acid and sulfur corrections: ${ACID_CONVENTION_TEXT[c]}`),
        first.buoyancy ? `Certified value of the benzoic acid corrected for air buoyancy (factor ${first.buoyancy.factor.toFixed(6)}).` : '',
      ].filter(Boolean),
      notices,
      acidConvention: conventions.map(c => ACID_CONVENTION_TEXT[c]).join(' ') || null,
      unit: policy.displayUnit,
      rows: certRows,
      duplicate: { status: dup.status, message: dup.message, n: dup.n, rangeJPerG: dup.range, limitJPerG: dup.limit, reportedAs },
      determinations: views.map(v => ({
        resultId: v.id, revision: v.revision, firedAt: v.firedAt ? new Date(v.firedAt).toISOString() : null, vesselName: v.vesselName ?? '', sampleMassG: v.values.sampleMassG,
        temperatureRiseK: v.values.temperatureRiseK, grossAdJPerG: v.values.grossJPerG['air-dried']!, expandedUncertaintyJPerG: v.values.uncertainty?.expandedUncertaintyJPerG ?? null,
        signedBy: v.signature?.signerName ?? '', signedAt: v.signature ? new Date(v.signature.signedAt).toISOString() : '',
      })),
      analysis,
      testedFrom: fired[0] ?? null,
      testedTo: fired[fired.length - 1] ?? null,
      signers: [...new Map(views.filter(v => v.signature).map(v => [v.signature!.signerName, { name: v.signature!.signerName, signedAt: new Date(v.signature!.signedAt).toISOString() }])).values()],
      issuedBy: issuer.name,
      replaces: previous?.reportNumber ?? null,
      statements: [
        'The results relate only to the sample as tested. "As determined" is the analysis sample as weighed (air-dried basis).',
        `U is the expanded uncertainty with coverage factor k = 2 (about 95 % coverage), evaluated as in JCGM 100:2008 from the energy equivalent's series, the certified value of the reference benzoic acid, the repeatability of the determination, the temperature rise, the masses and the corrections; for the other bases and the net values also from the moisture, ash, hydrogen, oxygen and nitrogen figures.`,
        `Duplicate determinations are accepted when they differ by no more than the repeatability limit r = ${fmtFixed(policy.repeatabilityJPerG, 0)} J/g (ISO 1928); results of different laboratories are expected to agree within the reproducibility limit R = ${fmtFixed(policy.reproducibilityJPerG, 0)} J/g (dry basis).`,
        'This certificate shall not be reproduced except in full without the written approval of the laboratory.',
      ],
    },
  }
}

const fmtFixed = (v: number, d: number) => v.toLocaleString('en-GB', { minimumFractionDigits: d, maximumFractionDigits: d })
