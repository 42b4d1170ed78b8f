import { describe, expect, it } from 'vitest'
import { energyEquivalent } from '../../../shared/domain/results/energy-equivalent'
import {
  NET_CALORIFIC_COEFFICIENTS,
  SULFUR_CORRECTION_J_PER_PCT_G,
  acidCorrectionFromTitrationJ,
  fuseCorrectionJ,
  grossCalorificValue,
  netCalorificValueConstantPressure,
  netCalorificValueConstantVolume,
  nitricAcidCorrectionJ,
  sulfurCorrectionJ,
  titrantJPerMl,
} from '../../../shared/domain/results/calorific-value'

// Data the checks are built from, with their sources.
const SRM_39J_J_PER_G = 26_434 // NIST SRM 39j certificate (bomb conditions, mass in vacuum)
const BA_DELTA_C_H_KJ_PER_MOL = -3226.9 // benzoic acid (s), standard enthalpy of combustion, NIST Chemistry WebBook
const DELTA_VAP_H_WATER_KJ_PER_MOL = 44.01 // water at 25 °C, NIST Chemistry WebBook / CODATA key values
const R = 8.314_462_618 // J/(mol·K), CODATA 2018
const T = 298.15 // K, the 25 °C reference temperature of ISO 1928
const M_H = 1.008 // IUPAC standard atomic weights (abridged)
const M_C = 12.011
const M_N = 14.007
const M_O = 15.999
const M_S = 32.06
const M_H2O = 2 * M_H + M_O
const CAL_IT_J = 4.1868 // NIST SP 811, Appendix B

const RT_KJ = (R * T) / 1000 // 2.4790 kJ/mol
const DELTA_VAP_U_WATER_KJ_PER_MOL = DELTA_VAP_H_WATER_KJ_PER_MOL - RT_KJ // ΔU = ΔH − Δn_gas·RT, Δn_gas = +1

describe('net calorific value coefficients re-derived (ISO 1928 / ISO 18125)', () => {
  // Per 1 mass-% H in 1 g of fuel: 0.01 g H → 0.01/(2·1.008) mol H2O, vaporised.
  const molWaterPerPctH = 0.01 / (2 * M_H)
  // Per 1 mass-% moisture: 0.01 g water.
  const molWaterPerPctM = 0.01 / M_H2O
  // Constant volume → constant pressure: q_p = q_v − Δn_gas·RT. Burning H takes ¼ mol O2 per mol H (Δn = −¼ per
  // mol H); fuel O frees O2 (Δn = +½ per mol O); fuel N leaves as N2 (Δn = +½ per mol N).
  const pvPerPctH = 0.25 * (0.01 / M_H) * RT_KJ * 1000
  const pvPerPctO = 0.5 * (0.01 / M_O) * RT_KJ * 1000
  const pvPerPctN = 0.5 * (0.01 / M_N) * RT_KJ * 1000

  it('212.2 J/g per % H at constant pressure = latent heat of the water formed − pV work', () => {
    // 0.004 960 mol × 44 010 J/mol = 218.30 J/g; − 0.002 480 mol × 2 479 J/mol = 6.15 J/g → 212.16 J/g.
    const derived = molWaterPerPctH * DELTA_VAP_H_WATER_KJ_PER_MOL * 1000 - pvPerPctH
    expect(derived).toBeCloseTo(NET_CALORIFIC_COEFFICIENTS.hydrogenConstantPressure, 1)
  })

  it('206.0 J/g per % H at constant volume = energy of vaporisation (ΔH − RT) of the water formed', () => {
    const derived = molWaterPerPctH * DELTA_VAP_U_WATER_KJ_PER_MOL * 1000 // 0.004 960 × 41 531 = 206.01
    expect(derived).toBeCloseTo(NET_CALORIFIC_COEFFICIENTS.hydrogenConstantVolume, 1)
  })

  it('24.43 and 23.05 J/g per % moisture', () => {
    expect(molWaterPerPctM * DELTA_VAP_H_WATER_KJ_PER_MOL * 1000).toBeCloseTo(NET_CALORIFIC_COEFFICIENTS.moistureConstantPressure, 2)
    expect(molWaterPerPctM * DELTA_VAP_U_WATER_KJ_PER_MOL * 1000).toBeCloseTo(NET_CALORIFIC_COEFFICIENTS.moistureConstantVolume, 2)
  })

  it('0.8 J/g per % (O + N) is the pV work of the O2 and N2 released, one rounded figure for both', () => {
    // O: 0.775 J/g per %, N: 0.885 J/g per %; the standard uses 0.8 for either, within 0.1 J/g per %.
    expect(Math.abs(pvPerPctO - NET_CALORIFIC_COEFFICIENTS.oxygenNitrogenConstantPressure)).toBeLessThan(0.1)
    expect(Math.abs(pvPerPctN - NET_CALORIFIC_COEFFICIENTS.oxygenNitrogenConstantPressure)).toBeLessThan(0.1)
  })
})

describe('net calorific value of benzoic acid against the NIST WebBook enthalpy of combustion', () => {
  // C7H6O2: H = 6·1.008/122.123 = 4.952 %, O = 2·15.999/122.123 = 26.20 % (IUPAC atomic weights).
  const molar = 7 * M_C + 6 * M_H + 2 * M_O
  const hydrogenDryPct = (100 * 6 * M_H) / molar
  const oxygenDryPct = (100 * 2 * M_O) / molar
  // Standard-state gross value at constant volume: ΔcU° = ΔcH° − Δn_gas·RT, Δn_gas = 7 CO2 − 7.5 O2 = −0.5 mol.
  const grossDryJPerG = (-(BA_DELTA_C_H_KJ_PER_MOL + 0.5 * RT_KJ) / molar) * 1000 // ≈ 26 413 J/g
  // The coefficients are rounded to 0.1 J/g per % and O and N share 0.8: about 1 J/g at most here, so 0.01 %.
  const tolerance = 1e-4 * grossDryJPerG

  it('at constant pressure: −ΔcH° with the 3 mol of water as vapour', () => {
    const expected = ((-BA_DELTA_C_H_KJ_PER_MOL - 3 * DELTA_VAP_H_WATER_KJ_PER_MOL) / molar) * 1000 // ≈ 25 342 J/g
    const net = netCalorificValueConstantPressure({ grossDryJPerG, hydrogenDryPct, oxygenDryPct, nitrogenDryPct: 0, moisturePct: 0 })
    expect(Math.abs(net - expected)).toBeLessThan(tolerance)
  })

  it('at constant volume: −ΔcU° with the water as vapour', () => {
    const expected = grossDryJPerG - ((3 * DELTA_VAP_U_WATER_KJ_PER_MOL) / molar) * 1000 // ≈ 25 393 J/g
    const net = netCalorificValueConstantVolume({ grossDryJPerG, hydrogenDryPct, moisturePct: 0 })
    expect(Math.abs(net - expected)).toBeLessThan(tolerance)
  })

  it('with 10 % moisture: 90 % of the dry net value less the vaporisation of 0.1 g water per g', () => {
    const dryNet = ((-BA_DELTA_C_H_KJ_PER_MOL - 3 * DELTA_VAP_H_WATER_KJ_PER_MOL) / molar) * 1000
    const expected = 0.9 * dryNet - (0.1 / M_H2O) * DELTA_VAP_H_WATER_KJ_PER_MOL * 1000 // ≈ 22 564 J/g
    const net = netCalorificValueConstantPressure({ grossDryJPerG, hydrogenDryPct, oxygenDryPct, nitrogenDryPct: 0, moisturePct: 10 })
    expect(Math.abs(net - expected)).toBeLessThan(tolerance)
  })

  it('refuses a moisture of 100 % or more', () => {
    expect(() => netCalorificValueConstantVolume({ grossDryJPerG, hydrogenDryPct, moisturePct: 100 })).toThrow(RangeError)
  })
})

describe('grossCalorificValue (ASTM D5865; ISO 1928)', () => {
  const fuseJ = fuseCorrectionJ(10, 9.6) // 10 cm nickel-chromium wire × 9.6 J/cm (from memory)

  it('recovers the NIST SRM 39j value when benzoic acid is measured as an unknown', () => {
    const eps = energyEquivalent({ benzoicAcidMassG: 1.0003, benzoicAcidJPerG: SRM_39J_J_PER_G, temperatureRiseK: 2.5190, fuseJ })
    // A 0.8000 g pellet releases 0.8000 × 26 434 J plus the fuse; the calorimeter shows that heat divided by ε.
    const theta = (0.8 * SRM_39J_J_PER_G + fuseJ) / eps
    expect(grossCalorificValue({ energyEquivalentJPerK: eps, temperatureRiseK: theta, sampleMassG: 0.8, fuseJ })).toBeCloseTo(SRM_39J_J_PER_G, 6)
  })

  it('subtracts every correction before dividing by the mass', () => {
    const input = { energyEquivalentJPerK: 10_500, temperatureRiseK: 2.6, sampleMassG: 1.05, fuseJ, acidJ: 40, sulfurJ: 86.25, aidJ: 0 }
    expect(grossCalorificValue(input)).toBeCloseTo((10_500 * 2.6 - 96 - 40 - 86.25) / 1.05, 9)
  })

  it('refuses a zero mass', () => {
    expect(() => grossCalorificValue({ energyEquivalentJPerK: 10_500, temperatureRiseK: 2.6, sampleMassG: 0 })).toThrow(RangeError)
  })
})

describe('thermochemical corrections', () => {
  it('fuse: burnt length × J/cm (ASTM D240 / D5865)', () => {
    expect(fuseCorrectionJ(7.5, 9.6)).toBeCloseTo(72, 10)
  })

  it('nitric acid: 0.0725 mol/L titrant ≈ 4.33 J/mL with 59.7 kJ/mol (ISO 1928, from memory)', () => {
    // 0.0725 mmol/mL × 59.7 J/mmol = 4.328 J/mL; 0.0725 N is the ASTM D240 alkali (from memory).
    expect(titrantJPerMl(0.0725)).toBeCloseTo(0.0725 * 59.7, 10)
    expect(acidCorrectionFromTitrationJ(8.5, titrantJPerMl(0.0725))).toBeCloseTo(8.5 * 0.0725 * 59.7, 10)
    // ISO style from moles of HNO3 formed: 0.5 mmol × 59.7 kJ/mol = 29.85 J.
    expect(nitricAcidCorrectionJ(0.0005)).toBeCloseTo(29.85, 10)
  })

  it('sulfur: 57.5 J per %S per g re-derived from the ASTM heats of formation', () => {
    // ASTM convention (as summarised in secondary sources): H2SO4 from SO2 72.2 kcal/mol (36.1 cal/meq), HNO3 14.1 kcal/mol.
    // The titration already counted each mol H2SO4 as 2 mol HNO3, so per mol S: 72.2 − 2 × 14.1 = 44.0 kcal.
    // Per %S per g of sample: 0.01 g S / 32.06 g/mol × 44 000 cal/mol × 4.1868 J/cal_IT = 57.46 J.
    const derived = (0.01 / M_S) * (72.2 - 2 * 14.1) * 1000 * CAL_IT_J
    expect(derived).toBeCloseTo(SULFUR_CORRECTION_J_PER_PCT_G, 1)
    // 1.50 % S in a 1.0000 g sample → 57.5 × 1.50 × 1.0000 = 86.25 J (ASTM D5865 form, from memory).
    expect(sulfurCorrectionJ(1.5, 1)).toBeCloseTo(86.25, 10)
  })

  it('refuses impossible inputs', () => {
    expect(() => sulfurCorrectionJ(101, 1)).toThrow(RangeError)
    expect(() => fuseCorrectionJ(-1, 9.6)).toThrow(RangeError)
    expect(() => titrantJPerMl(0)).toThrow(RangeError)
  })
})
