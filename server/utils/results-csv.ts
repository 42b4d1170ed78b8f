// The columns of the results CSV: each header names its unit, and its value is read from the same place the pages read.
import type { DuplicateSummary } from './result-duplicates'
import type { ResultView } from './results'
import type { CsvCell } from './csv'

type Column = readonly [header: string, value: (v: ResultView, duplicate: DuplicateSummary | undefined) => CsvCell]

const r = (v: number | null | undefined, d: number) => (typeof v === 'number' ? Number(v.toFixed(d)) : null)
const iso = (d: Date | string | null | undefined) => (d ? new Date(d).toISOString() : null)

export const RESULT_CSV_COLUMNS: readonly Column[] = [
  ['result_id', v => v.id],
  ['revision', v => v.revision],
  ['current', v => v.current],
  ['sample_code', v => v.sampleCode],
  ['kind', v => v.kind],
  ['vessel', v => v.vesselName],
  ['fired_at (UTC)', v => iso(v.firedAt)],
  ['fired_by', v => v.firedByName],
  ['sample_mass (g)', v => v.values.sampleMassG],
  ['temperature_rise (K)', v => r(v.values.temperatureRiseK, 5)],
  ['temperature_rise_source', v => v.values.temperatureRiseSource],
  ['energy_equivalent (J/K)', v => r(v.values.energyEquivalent?.valueJPerK, 2)],
  ['fuse_correction (J)', v => r(v.values.corrections.fuseJ, 2)],
  ['acid_correction (J)', v => r(v.values.corrections.acidJ, 2)],
  ['acid_convention', v => v.values.corrections.acidConvention],
  ['acid_measured', v => v.values.corrections.acidMeasured],
  ['sulfur_correction (J)', v => r(v.values.corrections.sulfurJ, 2)],
  ['aid_correction (J)', v => r(v.values.corrections.aidJ, 2)],
  ['aid_value_source', v => v.values.corrections.aidValueSource],
  ['gross_ad (J/g)', v => r(v.values.grossJPerG['air-dried'], 1)],
  ['gross_dry (J/g)', v => r(v.values.grossJPerG.dry, 1)],
  ['gross_ar (J/g)', v => r(v.values.grossJPerG['as-received'], 1)],
  ['gross_daf (J/g)', v => r(v.values.grossJPerG['dry-ash-free'], 1)],
  ['net_p_ar (J/g)', v => r(v.values.netConstantPressureJPerG['as-received'], 1)],
  ['net_v_ar (J/g)', v => r(v.values.netConstantVolumeJPerG['as-received'], 1)],
  ['net_p_dry (J/g)', v => r(v.values.netConstantPressureJPerG.dry, 1)],
  ['expanded_uncertainty_k2 (J/g)', v => r(v.values.uncertainty?.expandedUncertaintyJPerG, 1)],
  ['U_k2_gross_ad (J/g)', v => r(v.values.expandedUncertaintyByBasis?.gross['air-dried'], 1)],
  ['U_k2_gross_dry (J/g)', v => r(v.values.expandedUncertaintyByBasis?.gross.dry, 1)],
  ['U_k2_gross_ar (J/g)', v => r(v.values.expandedUncertaintyByBasis?.gross['as-received'], 1)],
  ['U_k2_gross_daf (J/g)', v => r(v.values.expandedUncertaintyByBasis?.gross['dry-ash-free'], 1)],
  ['U_k2_net_p_ar (J/g)', v => r(v.values.expandedUncertaintyByBasis?.netConstantPressure['as-received'], 1)],
  ['U_k2_net_v_ar (J/g)', v => r(v.values.expandedUncertaintyByBasis?.netConstantVolume['as-received'], 1)],
  ['provisional', v => v.values.provisional.length > 0],
  ['provisional_because', v => v.values.provisional.join('; ') || null],
  ['run_energy_equivalent (J/K)', v => r(v.values.energyEquivalentJPerK, 2)],
  ['check_deviation (%)', v => r(v.values.check?.deviationPct, 4)],
  ['duplicate_status', (v, d) => (v.kind === 'sample' ? d?.status ?? null : null)],
  ['status', v => v.status],
  ['signed_by', v => v.signature?.signerName ?? null],
  ['signed_at (UTC)', v => iso(v.signature?.signedAt)],
  ['revision_reason', v => v.reason],
]
