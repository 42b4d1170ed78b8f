import { describe, expect, it } from 'vitest'
import { asFiredFractions, compositionFromFormula } from '#shared/domain/composition'
import {
  combustionPerGram,
  fillGaugeForOxygenMol,
  GAS_CONSTANT,
  HUGGETT_J_PER_G_O2,
  oxygenCompressibility,
  oxygenDemandFromHeatMol,
  oxygenDemandMolPerG,
  oxygenMolesAt,
  vesselGas,
} from '#shared/domain/oxygen'

const T25 = 298.15

describe('oxygen demand', () => {
  it('gives benzoic acid 7.5 mol O2 per mol = 0.06141 mol/g', async () => {
    const { composition } = await compositionFromFormula('C7H6O2')
    // C7H6O2 + 7.5 O2 → 7 CO2 + 3 H2O; 7.5 / 122.123 = 0.06141 mol/g (stoichiometry, IUPAC atomic weights)
    expect(oxygenDemandMolPerG(composition)).toBeCloseTo(0.06141, 5)
  })

  it('uses the per-gram form C/12.011 + H/4.032 + 1.5·S/32.06 − O/31.998, sulfur to H2SO4', () => {
    // Stoichiometry: S + 1.5 O2 + H2O → H2SO4 takes more oxygen than S + O2 → SO2, so the larger demand is used.
    const expected = 0.7 / 12.011 + 0.05 / 4.032 + 1.5 * 0.01 / 32.06 - 0.1 / 31.998
    expect(oxygenDemandMolPerG({ C: 70, H: 5, S: 1, O: 10, N: 1.5, ash: 8 })).toBeCloseTo(expected, 12)
  })

  it('lets chlorine take hydrogen as HCl, lowering the demand by Cl/141.8', async () => {
    const pvc = await compositionFromFormula('C2H3Cl')
    // C2H3Cl + 2.5 O2 → 2 CO2 + H2O + HCl: 2.5 / 62.497 g/mol = 0.04000 mol/g (stoichiometry, IUPAC atomic weights)
    expect(oxygenDemandMolPerG(pvc.composition)).toBeCloseTo(2.5 / 62.497, 5)
  })

  it('gives sulfur its sulfuric-acid demand: 1.5 mol O2 per mol S', () => {
    // Pure sulfur S8 → H2SO4: 1.5 / 32.06 = 0.04679 mol/g (stoichiometry, IUPAC atomic weights).
    expect(oxygenDemandMolPerG({ S: 100 })).toBeCloseTo(1.5 / 32.06, 6)
  })

  it('does not invent hydrogen for chlorine beyond it (CCl4 forms Cl2, not HCl)', async () => {
    // CCl4 + O2 → CO2 + 2 Cl2: 1 mol O2 per 153.81 g (stoichiometry, IUPAC atomic weights); the old rule gave the same
    // demand but counted 4 HCl from hydrogen that is not there.
    const ccl4 = await compositionFromFormula('CCl4')
    expect(oxygenDemandMolPerG(ccl4.composition)).toBeCloseTo(1 / 153.81, 5)
    const per = combustionPerGram(asFiredFractions(ccl4.composition))
    expect(per.hclMol).toBeCloseTo(2 / 153.81, 5) // 2 Cl2 counted with the diatomic gases
  })

  it('estimates demand from heat at 13.1 kJ per g of O2 on the net-heat basis it was derived for', () => {
    expect(HUGGETT_J_PER_G_O2).toBe(13100) // Huggett 1980, Fire and Materials 4:61 (net heat of combustion)
    const estimate = oxygenDemandFromHeatMol(26454) // 1 g benzoic acid, NIST SRM 39j (weighed in air), a gross value
    // Gross → net with the water of (CH2)n: 2/3 mol H2O per mol O2 at 44.004 kJ/mol (CODATA key values).
    expect(estimate).toBeCloseTo(26454 / (13100 * 31.998 + (2 / 3) * 44004), 10)
    expect(oxygenDemandFromHeatMol(1000, true)).toBeCloseTo(1000 / 13100 / 31.998, 10)
    // Huggett's rule holds to about ±5 % for most organic fuels (Huggett 1980, from memory); stoichiometry gives 0.06141.
    expect(Math.abs(estimate / 0.06141 - 1)).toBeLessThan(0.05)
  })
})

describe('oxygen compressibility and amount', () => {
  it('matches the reference Z of O2 at 25 °C', () => {
    // Schmidt & Wagner EOS values (REFERENCES "Oxygen"): the virial model must agree within 0.0003.
    expect(oxygenCompressibility(3.0, T25)).toBeCloseTo(0.9819, 3)
    expect(Math.abs(oxygenCompressibility(3.0, T25) - 0.9819)).toBeLessThan(3e-4)
    expect(Math.abs(oxygenCompressibility(3.1, T25) - 0.9814)).toBeLessThan(3e-4)
    expect(Math.abs(oxygenCompressibility(4.053 + 0.101325, T25) - 0.9757)).toBeLessThan(3e-4) // 40 atm gauge
  })

  it('puts ≈ 0.382 mol O2 in 300 mL at 3.0 MPa gauge, 1.9 % above the ideal gas', () => {
    const real = oxygenMolesAt(3.101325, 300, T25)
    expect(Math.abs(real / 0.382 - 1)).toBeLessThan(0.003) // REFERENCES: ≈ 0.382 mol (Schmidt & Wagner EOS)
    const ideal = (3.101325e6 * 300e-6) / (GAS_CONSTANT * T25) // n = PV/RT, CODATA R
    expect(real / ideal - 1).toBeCloseTo(0.019, 3) // REFERENCES: ideal gas ≈ 1.9 % less
  })

  it('keeps the N2 of the air left in the vessel and counts its O2', () => {
    const gas = vesselGas({ volumeMl: 300, waterMl: 1, chargeVolumeMl: 1, fillGaugeMPa: 3.0, temperatureC: 25 })
    const v = 298e-6
    const nAir = (0.101325e6 * v) / (GAS_CONSTANT * T25) // air at 1 atm, ideal (NIST SP 811 atmosphere)
    expect(gas.freeVolumeMl).toBeCloseTo(298, 10) // 300 − 1 mL water − 1 mL charge (common practice)
    expect(gas.nitrogenMol).toBeCloseTo(0.7905 * nAir, 10) // N2 + Ar = 1 − 0.2095 of dry air (ISO 2533)
    expect(gas.oxygenMol).toBeCloseTo(oxygenMolesAt(3.101325, 298, T25) - 0.7905 * nAir, 10)
  })

  it('inverts: the fill found for an amount of O2 gives that amount back', () => {
    const geometry = { volumeMl: 300, waterMl: 1, chargeVolumeMl: 1.2, temperatureC: 22 }
    const fill = fillGaugeForOxygenMol(0.3, geometry)
    expect(vesselGas({ ...geometry, fillGaugeMPa: fill }).oxygenMol).toBeCloseTo(0.3, 9)
  })
})
