// Oxygen the charge needs (stoichiometry) and oxygen the vessel holds (real-gas fill plus the air left inside).
import { type AsFiredFractions, type Composition, asFiredFractions, ATOMIC_WEIGHTS } from './composition'

/** Molar gas constant, J/(mol·K) (CODATA 2018, exact). */
export const GAS_CONSTANT = 8.314462618
/** Standard atmosphere, MPa (NIST SP 811). */
export const STANDARD_ATMOSPHERE_MPA = 0.101325
/** Mole fraction of O2 in dry air (ISO 2533 standard atmosphere, 20.946 % by volume, rounded as in the design brief). */
export const AIR_OXYGEN_MOLE_FRACTION = 0.2095
/** Net heat released per gram of O2 consumed by most organic fuels, J/g (Huggett 1980, Fire and Materials 4:61; net heat of combustion basis). */
export const HUGGETT_J_PER_G_O2 = 13100
/** Molar mass of O2, g/mol (IUPAC atomic weights). */
export const O2_MOLAR_MASS = 2 * 15.999

// Critical point of O2 as in Schmidt & Wagner 1985 (Fluid Phase Equilib. 19:175) and its acentric factor; values from memory, checked through the Z tests.
const O2_CRITICAL_TEMPERATURE_K = 154.581
const O2_CRITICAL_PRESSURE_PA = 5.043e6
const O2_ACENTRIC_FACTOR = 0.0222

const A_H = ATOMIC_WEIGHTS.H ?? 1.008
const A_C = ATOMIC_WEIGHTS.C ?? 12.011
const A_N = ATOMIC_WEIGHTS.N ?? 14.007
const A_S = ATOMIC_WEIGHTS.S ?? 32.06
const A_Cl = ATOMIC_WEIGHTS.Cl ?? 35.45
const WATER_MOLAR_MASS = 2 * A_H + 15.999

/** Moles per gram of fuel: O2 consumed and gaseous products of complete combustion. */
export interface CombustionPerGram {
  oxygenDemandMol: number
  co2Mol: number
  h2oMol: number
  so2Mol: number
  hclMol: number
  n2Mol: number
}

/**
 * Complete combustion of one gram as fired (stoichiometry, IUPAC atomic weights): C → CO2, H → H2O, N → N2,
 * Cl → HCl as far as the sample's own hydrogen goes and Cl2 beyond it (no oxygen either way), and S → H2SO4
 * (SO2 + ½ O2 + H2O, 1.5 O2 per S) because in a vessel with water the sulfur ends as sulfuric acid, which takes
 * more oxygen than SO2 (1 O2 per S): the larger demand is used. Demand = C/12.011 + H'/4.032 + 1.5·S/32.06 −
 * O/31.998, H' the hydrogen not bound as HCl. Moisture leaves as water vapour and needs no oxygen. The sulfur is
 * left in the gas as SO2 for the peak-pressure bound (more gas, so the bound stays an upper bound); Cl2 is
 * counted with HCl (both diatomic gases). The demand is negative for oxygen-rich substances.
 */
export function combustionPerGram(f: AsFiredFractions): CombustionPerGram {
  const nH = f.H / A_H
  const nCl = f.Cl / A_Cl
  const hcl = Math.min(nH, nCl)
  const cl2 = (nCl - hcl) / 2
  const waterH = nH - hcl
  return {
    oxygenDemandMol: f.C / A_C + waterH / 4 + (SULFUR_OXYGEN_PER_ATOM * f.S) / A_S - f.O / O2_MOLAR_MASS,
    co2Mol: f.C / A_C,
    h2oMol: waterH / 2 + f.moisture / WATER_MOLAR_MASS,
    so2Mol: f.S / A_S,
    hclMol: hcl + cl2,
    n2Mol: f.N / A_N / 2,
  }
}

/** O2 per S atom: 1.5 to H2SO4 (the larger of SO2, 1, and H2SO4, 1.5; stoichiometry). */
export const SULFUR_OXYGEN_PER_ATOM = 1.5
/** Sulfur product the oxygen demand is computed for. */
export const SULFUR_PRODUCT = 'H2SO4'

/** O2 demand per gram as fired, mol/g: C/12.011 + H/4.032 + 1.5·S/32.06 − O/31.998 (stoichiometry; S to H2SO4; Cl to HCl). */
export function oxygenDemandMolPerG(c: Composition): number {
  return combustionPerGram(asFiredFractions(c)).oxygenDemandMol
}

/** Enthalpy of vaporisation of water at 25 °C, J/mol: ΔfH°(H2O, l) − ΔfH°(H2O, g) = −285.830 + 241.826 kJ/mol (CODATA key values). */
export const WATER_VAPORISATION_J_PER_MOL = 44004

/**
 * O2 demand estimated from a gross heat, mol. Huggett's 13.1 kJ per g O2 (Huggett 1980, Fire and Materials 4:61)
 * was derived for the NET heat of combustion (water as vapour), so the gross heat is first turned to net with the
 * water an unknown fuel forms, taken as that of (CH2)n (2/3 mol H2O per mol O2, common practice assumption):
 * n = Q_gross / (13,100·31.998 + (2/3)·44,004) J/mol. With waterFree (metal fuse wire), net = gross.
 */
export function oxygenDemandFromHeatMol(grossHeatJ: number, waterFree = false): number {
  const perMolO2 = HUGGETT_J_PER_G_O2 * O2_MOLAR_MASS + (waterFree ? 0 : (2 / 3) * WATER_VAPORISATION_J_PER_MOL)
  return grossHeatJ / perMolO2
}

/** Gauge (as read on the regulator) to absolute pressure, adding one standard atmosphere (NIST SP 811). */
export function gaugeToAbsoluteMPa(gaugeMPa: number): number {
  return gaugeMPa + STANDARD_ATMOSPHERE_MPA
}

/** Absolute to gauge pressure, subtracting one standard atmosphere (NIST SP 811). */
export function absoluteToGaugeMPa(absoluteMPa: number): number {
  return absoluteMPa - STANDARD_ATMOSPHERE_MPA
}

/** Second virial coefficient of O2, m³/mol (Tsonopoulos 1974, AIChE J. 20:263, with O2 critical constants). */
export function oxygenSecondVirial(temperatureK: number): number {
  const tr = O2_CRITICAL_TEMPERATURE_K / temperatureK
  const f0 = 0.1445 - 0.33 * tr - 0.1385 * tr ** 2 - 0.0121 * tr ** 3 - 0.000607 * tr ** 8
  const f1 = 0.0637 + 0.331 * tr ** 2 - 0.423 * tr ** 3 - 0.008 * tr ** 8
  return ((f0 + O2_ACENTRIC_FACTOR * f1) * GAS_CONSTANT * O2_CRITICAL_TEMPERATURE_K) / O2_CRITICAL_PRESSURE_PA
}

/** Third virial coefficient of O2, m⁶/mol² (Orbey & Vera 1983, AIChE J. 29:107, with O2 critical constants). */
export function oxygenThirdVirial(temperatureK: number): number {
  const tr = O2_CRITICAL_TEMPERATURE_K / temperatureK
  const g0 = 0.01407 + 0.02432 * tr ** 2.8 - 0.00313 * tr ** 10.5
  const g1 = -0.02676 + 0.0177 * tr ** 2.8 + 0.04 * tr ** 3 - 0.003 * tr ** 6 - 0.00228 * tr ** 10.5
  const scale = (GAS_CONSTANT * O2_CRITICAL_TEMPERATURE_K) / O2_CRITICAL_PRESSURE_PA
  return (g0 + O2_ACENTRIC_FACTOR * g1) * scale * scale
}

/** Pressure of O2 at a molar density, MPa: P = ρRT(1 + Bρ + Cρ²) (virial equation; B, C as above). */
export function oxygenPressureMPa(molPerM3: number, temperatureK: number): number {
  const b = oxygenSecondVirial(temperatureK)
  const c = oxygenThirdVirial(temperatureK)
  return (molPerM3 * GAS_CONSTANT * temperatureK * (1 + b * molPerM3 + c * molPerM3 * molPerM3)) / 1e6
}

/** Molar density of O2, mol/m³, solving P = ρRT(1 + Bρ + Cρ²) by Newton's method (virial equation). */
export function oxygenMolarDensity(absoluteMPa: number, temperatureK: number): number {
  const b = oxygenSecondVirial(temperatureK)
  const c = oxygenThirdVirial(temperatureK)
  const rt = GAS_CONSTANT * temperatureK
  const p = absoluteMPa * 1e6
  let rho = p / rt
  for (let i = 0; i < 20; i++) {
    const f = rho * rt * (1 + b * rho + c * rho * rho) - p
    const df = rt * (1 + 2 * b * rho + 3 * c * rho * rho)
    const step = f / df
    rho -= step
    if (Math.abs(step) < 1e-10 * rho) break
  }
  return rho
}

/** Compressibility factor Z = P/(ρRT) of O2 (virial equation; Tsonopoulos and Orbey–Vera coefficients). */
export function oxygenCompressibility(absoluteMPa: number, temperatureK: number): number {
  return (absoluteMPa * 1e6) / (oxygenMolarDensity(absoluteMPa, temperatureK) * GAS_CONSTANT * temperatureK)
}

/** Moles of O2 in a volume, n = PV/(ZRT) (real gas, virial equation). */
export function oxygenMolesAt(absoluteMPa: number, volumeMl: number, temperatureK: number): number {
  return oxygenMolarDensity(absoluteMPa, temperatureK) * volumeMl * 1e-6
}

export interface VesselGasInput {
  volumeMl: number
  waterMl: number
  /** Volume taken by the charge itself (mass / density). */
  chargeVolumeMl: number
  fillGaugeMPa: number
  temperatureC: number
}

export interface VesselGas {
  freeVolumeMl: number
  temperatureK: number
  fillAbsoluteMPa: number
  compressibility: number
  totalMol: number
  airMol: number
  oxygenMol: number
  /** N2 of the air left in the vessel, argon included. */
  nitrogenMol: number
}

/** Free gas volume, mL = vessel − water − charge (common practice). */
export function freeVolumeMl(volumeMl: number, waterMl: number, chargeVolumeMl: number): number {
  return volumeMl - waterMl - chargeVolumeMl
}

/**
 * Gas in the closed vessel: air at one atmosphere is filled with O2 to the gauge pressure, so
 * n_total = P_abs·V/(Z·R·T), n_air = P_atm·V/(R·T), O2 = n_total − 0.7905·n_air, N2 = 0.7905·n_air
 * (real gas by the virial equation; air composition ISO 2533; ideal air at 1 atm, error < 0.1 %).
 */
export function vesselGas(input: VesselGasInput): VesselGas {
  const v = freeVolumeMl(input.volumeMl, input.waterMl, input.chargeVolumeMl)
  const t = input.temperatureC + 273.15
  const pAbs = gaugeToAbsoluteMPa(input.fillGaugeMPa)
  const totalMol = oxygenMolesAt(pAbs, v, t)
  const airMol = (STANDARD_ATMOSPHERE_MPA * 1e6 * v * 1e-6) / (GAS_CONSTANT * t)
  const nitrogenMol = airMol * (1 - AIR_OXYGEN_MOLE_FRACTION)
  return {
    freeVolumeMl: v,
    temperatureK: t,
    fillAbsoluteMPa: pAbs,
    compressibility: (pAbs * 1e6 * v * 1e-6) / (totalMol * GAS_CONSTANT * t),
    totalMol,
    airMol,
    oxygenMol: totalMol - nitrogenMol,
    nitrogenMol,
  }
}

/** Gauge fill that puts a given amount of O2 in the vessel, MPa: inverse of vesselGas via P = ρRT(1 + Bρ + Cρ²). */
export function fillGaugeForOxygenMol(oxygenMol: number, geometry: Omit<VesselGasInput, 'fillGaugeMPa'>): number {
  const v = freeVolumeMl(geometry.volumeMl, geometry.waterMl, geometry.chargeVolumeMl)
  const t = geometry.temperatureC + 273.15
  const airMol = (STANDARD_ATMOSPHERE_MPA * 1e6 * v * 1e-6) / (GAS_CONSTANT * t)
  const totalMol = oxygenMol + airMol * (1 - AIR_OXYGEN_MOLE_FRACTION)
  return absoluteToGaugeMPa(oxygenPressureMPa(totalMol / (v * 1e-6), t))
}
