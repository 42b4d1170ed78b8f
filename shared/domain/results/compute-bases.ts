// A determination's gross value on every basis the analysis allows, the net values, mineral-matter-free values (ASTM D388),
// and the expanded uncertainty of each, carried from the budget of the value as determined.
import { convertBasis } from './bases'
import type { Basis, BasisConditions } from './bases'
import { netCalorificValueConstantPressure, netCalorificValueConstantVolume } from './calorific-value'
import { mineralMatterFreeValue, mineralMatterPct } from './mineral-matter'
import type { ByBasis, MineralMatterFree, ResultNote, ResultValues } from './result-types'
import { propagate } from './uncertainty'

/**
 * Standard uncertainties of the analysis figures, mass-% (common practice: about a third of the repeatability limits of
 * the usual proximate and ultimate methods; oxygen by difference carries the others).
 */
export const ANALYSIS_STANDARD_UNCERTAINTY_PCT = { moisture: 0.07, ash: 0.07, hydrogen: 0.05, oxygen: 0.2, nitrogen: 0.03, sulfur: 0.02 } as const

const round = (v: number, d: number) => Math.round(v * 10 ** d) / 10 ** d

// Input vector of the propagation: q_ad, M_ad, M_ar, A_d, H_d, O_d, N_d, S_ad.
type X = readonly number[]
const at = (x: X, i: number) => x[i] as number
const conditions = (x: X): BasisConditions => ({ moistureAd: at(x, 1), moistureAr: at(x, 2), ashDry: at(x, 3) })
const grossOn = (b: Basis) => (x: X) => convertBasis(at(x, 0), 'air-dried', b, conditions(x))
const moistureOf = (b: Basis, x: X) => (b === 'dry' ? 0 : b === 'air-dried' ? at(x, 1) : at(x, 2))
const netVOn = (b: Basis) => (x: X) => netCalorificValueConstantVolume({ grossDryJPerG: grossOn('dry')(x), hydrogenDryPct: at(x, 4), moisturePct: moistureOf(b, x) })
const netPOn = (b: Basis) => (x: X) => netCalorificValueConstantPressure({ grossDryJPerG: grossOn('dry')(x), hydrogenDryPct: at(x, 4), oxygenDryPct: at(x, 5), nitrogenDryPct: at(x, 6), moisturePct: moistureOf(b, x) })
const sulfurDry = (x: X) => (at(x, 7) * 100) / (100 - at(x, 1))
const mmfDry = (x: X) => mineralMatterFreeValue(grossOn('dry')(x), at(x, 3), sulfurDry(x))
// Moist basis: ash and sulfur brought to the as-received basis, its total moisture taken as the inherent moisture.
const asReceived = (dryPct: number, x: X) => (dryPct * (100 - at(x, 2))) / 100
const mmfMoist = (x: X) => mineralMatterFreeValue(grossOn('as-received')(x), asReceived(at(x, 3), x), asReceived(sulfurDry(x), x))

/** Gross on every basis (ASTM D3180 / ISO 1170), net values (ISO 1928 / ISO 18125), mmf (ASTM D388), each with U (k = 2). */
export function basesAndNet(grossAd: number, ucGrossAd: number, a: ResultValues['analysis'], sulfurPctAd: number, missing: string[], notes: ResultNote[]) {
  const grossJPerG: ByBasis = { 'air-dried': grossAd }
  const netP: ByBasis = {}
  const netV: ByBasis = {}
  const expanded = { gross: { 'air-dried': 2 * ucGrossAd } as ByBasis, netConstantPressure: {} as ByBasis, netConstantVolume: {} as ByBasis }
  if (a.moistureAdPct === null) {
    missing.push('Moisture of the analysis sample not given: only the value as determined is reported (no dry, as-received, dry ash-free or net values).')
    return { grossJPerG, netP, netV, expanded, mmf: null }
  }
  const u = ANALYSIS_STANDARD_UNCERTAINTY_PCT
  const x: X = [grossAd, a.moistureAdPct, a.moistureArPct ?? 0, a.ashDryPct ?? 0, a.hydrogenDryPct ?? 0, a.oxygenDryPct ?? 0, a.nitrogenDryPct ?? 0, sulfurPctAd]
  const ux: X = [ucGrossAd, u.moisture, u.moisture, u.ash, u.hydrogen, u.oxygen, u.nitrogen, u.sulfur]
  const put = (target: ByBasis, targetU: ByBasis, basis: Basis, f: (x: X) => number) => {
    const p = propagate(f, x, ux)
    target[basis] = p.value
    targetU[basis] = p.expandedUncertainty
  }
  put(grossJPerG, expanded.gross, 'dry', grossOn('dry'))
  if (a.moistureArPct !== null) put(grossJPerG, expanded.gross, 'as-received', grossOn('as-received'))
  else missing.push('Total moisture as received not given: no as-received values.')
  if (a.ashDryPct !== null) put(grossJPerG, expanded.gross, 'dry-ash-free', grossOn('dry-ash-free'))
  else missing.push('Ash not given: no dry ash-free or mineral-matter-free value.')
  notes.push({
    figure: 'Bases',
    formula: 'dry = ad·100/(100 − M_ad); ar = dry·(100 − M_ar)/100; daf = dry·100/(100 − A_d)',
    source: 'ASTM D3180; ISO 1170',
    inputs: [
      { label: 'M_ad', value: a.moistureAdPct, unit: '%' },
      { label: 'M_ar', value: a.moistureArPct ?? 'not given', unit: a.moistureArPct === null ? '' : '%' },
      { label: 'A_d', value: a.ashDryPct ?? 'not given', unit: a.ashDryPct === null ? '' : '%' },
    ],
  })

  let mmf: MineralMatterFree | null = null
  if (a.ashDryPct !== null) {
    const p = propagate(mmfDry, x, ux)
    const sD = sulfurDry(x)
    const mm = mineralMatterPct(a.ashDryPct, sD)
    const moist = a.moistureArPct !== null ? propagate(mmfMoist, x, ux) : null
    mmf = { mineralMatterDryPct: mm, dryJPerG: p.value, dryExpandedUncertaintyJPerG: p.expandedUncertainty, moistJPerG: moist?.value ?? null, moistExpandedUncertaintyJPerG: moist?.expandedUncertainty ?? null }
    notes.push({
      figure: 'Mineral-matter-free basis (ASTM D388)',
      formula: 'MM = 1.08·A + 0.55·S; Q_mmf = (Q − 116.3·S)/(100 − MM)·100 (116.3 J/g = 50 Btu/lb per % S); moist: as-received moisture taken as the inherent moisture',
      source: 'ASTM D388 mineral-matter formulas',
      inputs: [{ label: 'MM (dry)', value: round(mm, 2), unit: '%' }, { label: 'S (dry)', value: round(sD, 3), unit: '%' }],
    })
  }

  if (a.hydrogenDryPct === null) {
    missing.push('Hydrogen not given: no net calorific values.')
    return { grossJPerG, netP, netV, expanded, mmf }
  }
  const bases: Basis[] = ['dry', 'air-dried', ...(a.moistureArPct !== null ? ['as-received' as const] : [])]
  for (const b of bases) {
    put(netV, expanded.netConstantVolume, b, netVOn(b))
    if (a.oxygenDryPct !== null && a.nitrogenDryPct !== null) put(netP, expanded.netConstantPressure, b, netPOn(b))
  }
  if (a.oxygenDryPct === null || a.nitrogenDryPct === null) missing.push('Oxygen or nitrogen not given: no net value at constant pressure.')
  notes.push({
    figure: 'Net calorific values',
    formula: 'q_p,net = [q_v,gr,d − 212.2·H_d − 0.8(O_d + N_d)](1 − 0.01M) − 24.43M;  q_v,net = [q_v,gr,d − 206.0·H_d](1 − 0.01M) − 23.05M',
    source: 'ISO 1928 / ISO 18125; uncertainty by JCGM 100:2008 with the analysis figures\' own uncertainties',
    inputs: [
      { label: 'q_v,gr,d', value: round(grossJPerG.dry!, 1), unit: 'J/g' },
      { label: 'H_d', value: a.hydrogenDryPct, unit: '%' },
      { label: 'O_d', value: a.oxygenDryPct ?? 'not given', unit: a.oxygenDryPct === null ? '' : '%' },
      { label: 'N_d', value: a.nitrogenDryPct ?? 'not given', unit: a.nitrogenDryPct === null ? '' : '%' },
    ],
  })
  return { grossJPerG, netP, netV, expanded, mmf }
}
