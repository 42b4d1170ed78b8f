// Upper bound of the pressure peak: constant volume, adiabatic, complete combustion, all heat into the gas.
import { asFiredFractions, compositionFromAtoms } from './composition'
import { combustionPerGram, GAS_CONSTANT, vesselGas } from './oxygen'
import type { LabPolicy } from './policy'

export type GasSpecies = 'O2' | 'N2' | 'CO2' | 'H2O' | 'SO2' | 'HCl'
export type GasAmounts = Partial<Record<GasSpecies, number>>

export const GAS_SPECIES: readonly GasSpecies[] = ['O2', 'N2', 'CO2', 'H2O', 'SO2', 'HCl']

/**
 * One temperature range of the NASA Glenn form: cp/R = a1/T² + a2/T + a3 + a4·T + a5·T² + a6·T³ + a7·T⁴,
 * with b1 (enthalpy) and b2 (entropy) integration constants (McBride, Zehe & Gordon 2002, NASA/TP-2002-211556).
 */
export interface NasaRange {
  tMinK: number
  tMaxK: number
  a: readonly [number, number, number, number, number, number, number]
  b1: number
  b2: number
}

// Coefficients of NASA/TP-2002-211556 (its thermo data file), ranges 200–1000 K and 1000–6000 K; the tests check them
// against JANAF cp, H and S, the CODATA enthalpies of formation, and the continuity of the two ranges at 1000 K.
export const NASA_GLENN_COEFFICIENTS: Readonly<Record<GasSpecies, readonly [NasaRange, NasaRange]>> = {
  O2: [
    { tMinK: 200, tMaxK: 1000, a: [-3.425563420e4, 4.847000970e2, 1.119010961, 4.293889240e-3, -6.836300520e-7, -2.023372700e-9, 1.039040018e-12], b1: -3.391454870e3, b2: 1.849699470e1 },
    { tMinK: 1000, tMaxK: 6000, a: [-1.037939022e6, 2.344830282e3, 1.819732036, 1.267847582e-3, -2.188067988e-7, 2.053719572e-11, -8.193467050e-16], b1: -1.689010929e4, b2: 1.738716506e1 },
  ],
  N2: [
    { tMinK: 200, tMaxK: 1000, a: [2.210371497e4, -3.818461820e2, 6.082738360, -8.530914410e-3, 1.384646189e-5, -9.625793620e-9, 2.519705809e-12], b1: 7.108460860e2, b2: -1.076003744e1 },
    { tMinK: 1000, tMaxK: 6000, a: [5.877124060e5, -2.239249073e3, 6.066949220, -6.139685500e-4, 1.491806679e-7, -1.923105485e-11, 1.061954386e-15], b1: 1.283210415e4, b2: -1.586640027e1 },
  ],
  CO2: [
    { tMinK: 200, tMaxK: 1000, a: [4.943650540e4, -6.264116010e2, 5.301725240, 2.503813816e-3, -2.127308728e-7, -7.689988780e-10, 2.849677801e-13], b1: -4.528198460e4, b2: -7.048279440 },
    { tMinK: 1000, tMaxK: 6000, a: [1.176962419e5, -1.788791477e3, 8.291523190, -9.223156780e-5, 4.863676880e-9, -1.891053312e-12, 6.330036590e-16], b1: -3.908350590e4, b2: -2.652669281e1 },
  ],
  H2O: [
    { tMinK: 200, tMaxK: 1000, a: [-3.947960830e4, 5.755731020e2, 9.317826530e-1, 7.222712860e-3, -7.342557370e-6, 4.955043490e-9, -1.336933246e-12], b1: -3.303974310e4, b2: 1.724205775e1 },
    { tMinK: 1000, tMaxK: 6000, a: [1.034972096e6, -2.412698562e3, 4.646110780, 2.291998307e-3, -6.836830480e-7, 9.426468930e-11, -4.822380530e-15], b1: -1.384286509e4, b2: -7.978148510 },
  ],
  SO2: [
    { tMinK: 200, tMaxK: 1000, a: [-5.310842140e4, 9.090311670e2, -2.356891244, 2.204449885e-2, -2.510781471e-5, 1.446300484e-8, -3.369070940e-12], b1: -4.113752080e4, b2: 4.045512519e1 },
    { tMinK: 1000, tMaxK: 6000, a: [-1.127640116e5, -8.252261380e2, 7.616178630, -1.999327610e-4, 5.655631430e-8, -5.454316610e-12, 2.918294102e-16], b1: -3.351308690e4, b2: -1.655776085e1 },
  ],
  HCl: [
    { tMinK: 200, tMaxK: 1000, a: [2.062588287e4, -3.093368855e2, 5.275418850, -4.828874220e-3, 6.195794600e-6, -3.040023782e-9, 4.916790030e-13], b1: -1.067782299e4, b2: -7.309305408 },
    { tMinK: 1000, tMaxK: 6000, a: [9.157749510e5, -2.770550211e3, 5.973539790, -3.629810060e-4, 4.735529190e-8, 2.810262054e-12, -6.656104220e-16], b1: 5.674958050e3, b2: -1.642825822e1 },
  ],
}

/** Highest temperature the polynomials cover, K (NASA/TP-2002-211556). */
export const NASA_MAX_TEMPERATURE_K = 6000

/**
 * Internal energy of vaporisation of water at 25 °C, J/mol: ΔvapU = ΔvapH − RT with
 * ΔvapH = ΔfH(g) − ΔfH(l) = −241.826 − (−285.830) kJ/mol (CODATA key values, Cox, Wagman & Medvedev 1989).
 */
export const WATER_VAPORISATION_U_J_PER_MOL = (285.83 - 241.826) * 1000 - GAS_CONSTANT * 298.15

function range(species: GasSpecies, t: number): NasaRange {
  const [low, high] = NASA_GLENN_COEFFICIENTS[species]
  return t < low.tMaxK ? low : high
}

/** Heat capacity cp, J/(mol·K), from the NASA Glenn polynomial (McBride, Zehe & Gordon 2002). */
export function heatCapacityJPerMolK(species: GasSpecies, t: number): number {
  const { a } = range(species, t)
  return GAS_CONSTANT * (a[0] / (t * t) + a[1] / t + a[2] + t * (a[3] + t * (a[4] + t * (a[5] + t * a[6]))))
}

/** Enthalpy including the enthalpy of formation at 298.15 K, J/mol (McBride, Zehe & Gordon 2002). */
export function enthalpyJPerMol(species: GasSpecies, t: number): number {
  const { a, b1 } = range(species, t)
  const h = -a[0] / (t * t) + (a[1] * Math.log(t)) / t + a[2] + t * (a[3] / 2 + t * (a[4] / 3 + t * (a[5] / 4 + (t * a[6]) / 5))) + b1 / t
  return GAS_CONSTANT * t * h
}

/** Standard entropy, J/(mol·K) (McBride, Zehe & Gordon 2002). */
export function entropyJPerMolK(species: GasSpecies, t: number): number {
  const { a, b2 } = range(species, t)
  const s = -a[0] / (2 * t * t) - a[1] / t + a[2] * Math.log(t) + t * (a[3] + t * (a[4] / 2 + t * (a[5] / 3 + (t * a[6]) / 4))) + b2
  return GAS_CONSTANT * s
}

/** Internal energy U = H − RT of an ideal gas, J/mol (thermodynamic identity; H from NASA/TP-2002-211556). */
export function internalEnergyJPerMol(species: GasSpecies, t: number): number {
  return enthalpyJPerMol(species, t) - GAS_CONSTANT * t
}

function totalMol(gas: GasAmounts): number {
  let n = 0
  for (const species of GAS_SPECIES) n += gas[species] ?? 0
  return n
}

/** Temperature reached when heatJ raises the gas at constant volume: Σ nᵢ[Uᵢ(T) − Uᵢ(T₀)] = Q, Newton with bisection (NASA polynomials). */
export function constantVolumeTemperatureK(gas: GasAmounts, heatJ: number, initialK: number): number {
  if (!(heatJ > 0)) return initialK
  let u0 = 0
  let cv0 = 0
  for (const species of GAS_SPECIES) {
    const n = gas[species] ?? 0
    if (n === 0) continue
    u0 += n * internalEnergyJPerMol(species, initialK)
    cv0 += n * (heatCapacityJPerMolK(species, 1500) - GAS_CONSTANT)
  }
  if (!(cv0 > 0)) return NASA_MAX_TEMPERATURE_K
  let lo = initialK
  let hi = NASA_MAX_TEMPERATURE_K
  let t = Math.min(hi, initialK + heatJ / cv0)
  for (let i = 0; i < 60; i++) {
    let u = 0
    let cv = 0
    for (const species of GAS_SPECIES) {
      const n = gas[species] ?? 0
      if (n === 0) continue
      u += n * internalEnergyJPerMol(species, t)
      cv += n * (heatCapacityJPerMolK(species, t) - GAS_CONSTANT)
    }
    const f = u - u0 - heatJ
    if (f > 0) hi = t
    else lo = t
    if (Math.abs(f) < 1e-6 * heatJ) return t
    let next = t - f / cv
    // Newton stays inside the bracket; otherwise bisect.
    if (!(next > lo && next < hi)) next = (lo + hi) / 2
    if (hi - lo < 1e-6) return next
    t = next
  }
  return t
}

export interface PeakBoundInput {
  /** Gas present before firing (O2 and N2 of the fill). */
  initialGas: GasAmounts
  /** O2 consumed by complete combustion (negative when the charge releases O2). */
  oxygenConsumedMol: number
  /** Gaseous products of complete combustion; water counted as vapour. */
  products: GasAmounts
  /** Heat released at constant volume with liquid water, J (gross, as measured in the vessel). */
  heatJ: number
  freeVolumeMl: number
  initialTemperatureK: number
}

export interface PeakBound {
  temperatureK: number
  /** Absolute pressure, MPa. */
  pressureMPa: number
  gasMol: GasAmounts
  totalMol: number
  /** Heat left for the gas after the product water is vaporised, J. */
  heatIntoGasJ: number
}

/**
 * P = n·R·T/V at the adiabatic constant-volume temperature (ideal gas at the peak, no dissociation,
 * no heat to the walls: an upper bound; heat capacities McBride, Zehe & Gordon 2002). The product water is
 * vapour at the peak, so its energy of vaporisation at 25 °C is taken from the gross heat.
 */
export function peakPressureBound(input: PeakBoundInput): PeakBound {
  const gas: GasAmounts = {}
  for (const species of GAS_SPECIES) {
    const n = (input.initialGas[species] ?? 0) + (input.products[species] ?? 0)
    if (n > 0) gas[species] = n
  }
  gas.O2 = Math.max(0, (gas.O2 ?? 0) - input.oxygenConsumedMol)
  const heatIntoGasJ = input.heatJ - (input.products.H2O ?? 0) * WATER_VAPORISATION_U_J_PER_MOL
  const temperatureK = constantVolumeTemperatureK(gas, heatIntoGasJ, input.initialTemperatureK)
  const n = totalMol(gas)
  return {
    temperatureK,
    pressureMPa: (n * GAS_CONSTANT * temperatureK) / (input.freeVolumeMl * 1e-6) / 1e6,
    gasMol: gas,
    totalMol: n,
    heatIntoGasJ,
  }
}

/** The proof charge a vessel was tested with; fill is gauge. */
export interface ProofCharge {
  massG: number
  heatingValueJPerG: number
  fillPressureMPa: number
}

/** Benzoic acid, C7H6O2: the proof-charge fuel (NIST SRM 39j is benzoic acid). */
export const BENZOIC_ACID_ATOMS = { C: 7, H: 6, O: 2 } as const

/** The vessel's proof charge, or the policy default (2 g benzoic acid at 40 atm gauge, ASTM E144 summaries). */
export function proofChargeOf(vessel: { proofCharge?: ProofCharge }, policy: LabPolicy): ProofCharge {
  return vessel.proofCharge ?? {
    massG: policy.proofChargeMassG,
    heatingValueJPerG: policy.proofChargeHeatingValueJPerG,
    fillPressureMPa: policy.proofChargeFillPressureMPa,
  }
}

/** Peak-pressure bound of the vessel's proof charge of benzoic acid, same model as the charge. */
export function proofChargeBound(vessel: { volumeMl: number; proofCharge?: ProofCharge }, policy: LabPolicy): PeakBound {
  const proof = proofChargeOf(vessel, policy)
  const per = combustionPerGram(asFiredFractions(compositionFromAtoms(BENZOIC_ACID_ATOMS).composition))
  const gas = vesselGas({
    volumeMl: vessel.volumeMl,
    waterMl: policy.waterMl,
    chargeVolumeMl: proof.massG / policy.sampleDensityGPerMl,
    fillGaugeMPa: proof.fillPressureMPa,
    temperatureC: policy.labTemperatureC,
  })
  return peakPressureBound({
    initialGas: { O2: gas.oxygenMol, N2: gas.nitrogenMol },
    oxygenConsumedMol: per.oxygenDemandMol * proof.massG,
    products: { CO2: per.co2Mol * proof.massG, H2O: per.h2oMol * proof.massG },
    heatJ: proof.massG * proof.heatingValueJPerG,
    freeVolumeMl: gas.freeVolumeMl,
    initialTemperatureK: gas.temperatureK,
  })
}
