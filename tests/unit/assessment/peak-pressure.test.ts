import { describe, expect, it } from 'vitest'
import { asFiredFractions, compositionFromAtoms } from '#shared/domain/composition'
import { combustionPerGram, GAS_CONSTANT, oxygenMolesAt, vesselGas } from '#shared/domain/oxygen'
import {
  enthalpyJPerMol,
  entropyJPerMolK,
  GAS_SPECIES,
  heatCapacityJPerMolK,
  NASA_GLENN_COEFFICIENTS,
  peakPressureBound,
  proofChargeBound,
  WATER_VAPORISATION_U_J_PER_MOL,
} from '#shared/domain/peak-pressure'
import { DEFAULT_POLICY } from '#shared/domain/policy'
import { makeVessel } from './factories'

const T0 = 298.15
const dH = (species: Parameters<typeof enthalpyJPerMol>[0], t: number) => (enthalpyJPerMol(species, t) - enthalpyJPerMol(species, T0)) / 1000

describe('NASA Glenn polynomials', () => {
  it('reproduce JANAF heat capacities at 298.15 K', () => {
    // JANAF (Chase 1998) cp°(298.15 K), J/(mol·K), as quoted in the brief; SO2 and HCl from memory.
    const janaf = { O2: 29.38, N2: 29.12, CO2: 37.12, H2O: 33.58, SO2: 39.878, HCl: 29.136 }
    for (const [species, cp] of Object.entries(janaf)) {
      expect(Math.abs(heatCapacityJPerMolK(species as keyof typeof janaf, T0) / cp - 1)).toBeLessThan(0.0015)
    }
  })

  it('reproduce JANAF enthalpy increments at 1000 K and 2000 K', () => {
    // JANAF (Chase 1998) H° − H°(298.15), kJ/mol (from memory): 1000 K within 0.1 %, 2000 K within 0.5 %
    // (H2O differs most there: the NASA fit follows the newer water data).
    const at1000 = { O2: 22.707, N2: 21.46, CO2: 33.397, H2O: 26.0 }
    const at2000 = { O2: 59.199, N2: 56.137, CO2: 91.439, H2O: 72.79 }
    for (const [species, h] of Object.entries(at1000)) expect(Math.abs(dH(species as keyof typeof at1000, 1000) / h - 1)).toBeLessThan(0.001)
    for (const [species, h] of Object.entries(at2000)) expect(Math.abs(dH(species as keyof typeof at2000, 2000) / h - 1)).toBeLessThan(0.005)
  })

  it('reproduce standard enthalpies of formation and entropies at 298.15 K', () => {
    // ΔfH°, kJ/mol: CODATA key values (Cox, Wagman & Medvedev 1989, from memory), within their uncertainty
    expect(enthalpyJPerMol('O2', T0) / 1000).toBeCloseTo(0, 2)
    expect(enthalpyJPerMol('N2', T0) / 1000).toBeCloseTo(0, 2)
    expect(Math.abs(enthalpyJPerMol('CO2', T0) / 1000 + 393.51)).toBeLessThan(0.13)
    expect(Math.abs(enthalpyJPerMol('H2O', T0) / 1000 + 241.826)).toBeLessThan(0.04)
    expect(Math.abs(enthalpyJPerMol('SO2', T0) / 1000 + 296.81)).toBeLessThan(0.2)
    expect(Math.abs(enthalpyJPerMol('HCl', T0) / 1000 + 92.31)).toBeLessThan(0.1)
    // S°(298.15 K), J/(mol·K): JANAF (Chase 1998, from memory), within 0.02 J/(mol·K)
    const s = { O2: 205.147, N2: 191.609, CO2: 213.795, H2O: 188.834, SO2: 248.212, HCl: 186.902 }
    for (const [species, value] of Object.entries(s)) expect(Math.abs(entropyJPerMolK(species as keyof typeof s, T0) - value)).toBeLessThan(0.02)
  })

  it('join their two ranges at 1000 K (a mistyped coefficient would show here)', () => {
    for (const species of GAS_SPECIES) {
      const [low, high] = NASA_GLENN_COEFFICIENTS[species]
      expect(low.tMaxK).toBe(1000)
      expect(high.tMinK).toBe(1000)
      // The two ranges meet: cp, H and S at 999.999 and 1000 K agree.
      expect(heatCapacityJPerMolK(species, 999.999)).toBeCloseTo(heatCapacityJPerMolK(species, 1000), 2)
      expect(enthalpyJPerMol(species, 999.999)).toBeCloseTo(enthalpyJPerMol(species, 1000), -1)
      expect(entropyJPerMolK(species, 999.999)).toBeCloseTo(entropyJPerMolK(species, 1000), 2)
    }
  })

  it('take ΔvapU of water at 25 °C from the CODATA enthalpies of formation', () => {
    // ΔvapH = −241.826 − (−285.830) = 44.004 kJ/mol (CODATA key values); ΔvapU = ΔvapH − RT = 41.525 kJ/mol
    expect(WATER_VAPORISATION_U_J_PER_MOL / 1000).toBeCloseTo(44.004 - (GAS_CONSTANT * 298.15) / 1000, 6)
    expect(WATER_VAPORISATION_U_J_PER_MOL / 1000).toBeCloseTo(41.525, 3)
  })
})

describe('peak-pressure bound', () => {
  // REFERENCES check case: 1 g benzoic acid (26,454 J/g, NIST SRM 39j), 300 mL, 3.10 MPa abs of O2, 25 °C.
  const per = combustionPerGram(asFiredFractions(compositionFromAtoms({ C: 7, H: 6, O: 2 }).composition))
  const nO2 = oxygenMolesAt(3.1, 300, T0)
  const bound = peakPressureBound({
    initialGas: { O2: nO2 },
    oxygenConsumedMol: per.oxygenDemandMol,
    products: { CO2: per.co2Mol, H2O: per.h2oMol },
    heatJ: 26454,
    freeVolumeMl: 300,
    initialTemperatureK: T0,
  })

  it('gives ≈ 26.5 MPa and ≈ 2,370 K for the reference case', () => {
    expect(Math.abs(bound.pressureMPa / 26.5 - 1)).toBeLessThan(0.01) // REFERENCES [C]: ≈ 26.5 MPa (NASA polynomials)
    expect(Math.abs(bound.temperatureK / 2370 - 1)).toBeLessThan(0.01) // REFERENCES [C]: ≈ 2,370 K
    expect(bound.pressureMPa).toBeGreaterThan(26.3) // REFERENCES: ≈ 26.3 MPa with dissociation, which only lowers it
  })

  it('agrees with an independent hand calculation from JANAF enthalpies', () => {
    // Independent calculation, no NASA polynomial involved:
    //   gas after firing: O2 = 0.38227 − 0.06141, CO2 = 7/122.123, H2O = 3/122.123 mol (stoichiometry);
    //   heat for the gas Q' = 26,454 − 0.024565 · 41,525 J (water ends as vapour; CODATA ΔvapU);
    //   H° − H°(298) of each gas interpolated linearly between JANAF 2000 K and 2500 K (Chase 1998, from memory);
    //   U = H − R(T − 298.15); solve Σ n·ΔU(T) = Q' by bisection; P = nRT/V.
    const janaf2000 = { O2: 59.199, CO2: 91.439, H2O: 72.79 }
    const janaf2500 = { O2: 78.375, CO2: 121.926, H2O: 98.964 }
    const n = { O2: nO2 - 7.5 / 122.123, CO2: 7 / 122.123, H2O: 3 / 122.123 }
    const heat = 26454 - n.H2O * 41525
    const du = (t: number) => (Object.keys(n) as (keyof typeof n)[]).reduce((sum, sp) => {
      const h = (janaf2000[sp] + ((t - 2000) / 500) * (janaf2500[sp] - janaf2000[sp])) * 1000
      return sum + n[sp] * (h - 8.314462618 * (t - T0))
    }, 0)
    let lo = 2000
    let hi = 2500
    for (let i = 0; i < 60; i++) {
      const mid = (lo + hi) / 2
      if (du(mid) > heat) hi = mid
      else lo = mid
    }
    const total = n.O2 + n.CO2 + n.H2O
    const pHand = (total * 8.314462618 * lo) / 300e-6 / 1e6
    expect(Math.abs(bound.temperatureK / lo - 1)).toBeLessThan(0.005)
    expect(Math.abs(bound.pressureMPa / pHand - 1)).toBeLessThan(0.005)
  })

  it('computes the proof-charge bound with the same model (2 g benzoic acid at 40 atm gauge)', () => {
    const vessel = makeVessel()
    const proof = proofChargeBound(vessel, DEFAULT_POLICY)
    // Rebuilt by hand from the policy defaults: 2 g, 26,454 J/g, 4.053 MPa gauge, 1 mL water, 1 g/mL (ASTM E144 summaries).
    const gas = vesselGas({ volumeMl: 300, waterMl: 1, chargeVolumeMl: 2, fillGaugeMPa: 4.053, temperatureC: 25 })
    const byHand = peakPressureBound({
      initialGas: { O2: gas.oxygenMol, N2: gas.nitrogenMol },
      oxygenConsumedMol: 2 * per.oxygenDemandMol,
      products: { CO2: 2 * per.co2Mol, H2O: 2 * per.h2oMol },
      heatJ: 2 * 26454,
      freeVolumeMl: gas.freeVolumeMl,
      initialTemperatureK: gas.temperatureK,
    })
    expect(proof.pressureMPa).toBeCloseTo(byHand.pressureMPa, 9)
    expect(proof.pressureMPa).toBeGreaterThan(bound.pressureMPa)
    const custom = proofChargeBound(makeVessel({ proofCharge: { massG: 1, heatingValueJPerG: 26454, fillPressureMPa: 3.0 } }), DEFAULT_POLICY)
    expect(custom.pressureMPa).toBeLessThan(proof.pressureMPa)
  })
})
