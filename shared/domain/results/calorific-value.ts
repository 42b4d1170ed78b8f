// Gross calorific value at constant volume, its thermochemical corrections, and the net calorific values.
import { assertFinite, assertNonNegative, assertPositive } from './guards'

/** Energy of formation of aqueous nitric acid from N2, O2 and liquid water in the vessel, J/mol — ISO 1928 (from memory). */
export const NITRIC_ACID_FORMATION_J_PER_MOL = 59_700

/**
 * Sulfur correction, J per (mass-% S × g of sample), ASTM convention where the total-acid titration has already counted
 * the sulfuric acid as nitric acid — ASTM D240 / D5865 (from memory; it equals (72.2 − 2 × 14.1) kcal/mol S, see the test).
 */
export const SULFUR_CORRECTION_J_PER_PCT_G = 57.5

/** Coefficients of the net calorific value formulas, J/g per mass-% — ISO 1928 / ISO 18125 (re-derived in the test). */
export const NET_CALORIFIC_COEFFICIENTS = {
  /** Constant pressure: latent heat of the water formed from hydrogen less the pV work, per % H. */
  hydrogenConstantPressure: 212.2,
  /** Constant pressure: pV work of the O2 and N2 released, per % (O + N). */
  oxygenNitrogenConstantPressure: 0.8,
  /** Constant pressure: enthalpy of vaporisation of the moisture, per % M. */
  moistureConstantPressure: 24.43,
  /** Constant volume: energy of vaporisation of the water formed from hydrogen, per % H. */
  hydrogenConstantVolume: 206.0,
  /** Constant volume: energy of vaporisation of the moisture, per % M. */
  moistureConstantVolume: 23.05,
} as const

export interface GrossCalorificValueInput {
  energyEquivalentJPerK: number
  /** Corrected temperature rise θ, K. */
  temperatureRiseK: number
  /** Mass of the analysis sample, g. */
  sampleMassG: number
  fuseJ?: number
  acidJ?: number
  sulfurJ?: number
  /** Heat of combustion of any aid (benzoic acid pellet, oil, capsule, tape, cotton), J. */
  aidJ?: number
}

/** q_v,gr (J/g) = (ε·θ − e_fuse − e_acid − e_S − e_aid)/m — ASTM D5865; ISO 1928. */
export function grossCalorificValue(input: GrossCalorificValueInput): number {
  assertPositive(input.energyEquivalentJPerK, 'energyEquivalentJPerK')
  assertPositive(input.temperatureRiseK, 'temperatureRiseK')
  assertPositive(input.sampleMassG, 'sampleMassG')
  const corrections = [input.fuseJ ?? 0, input.acidJ ?? 0, input.sulfurJ ?? 0, input.aidJ ?? 0]
  corrections.forEach((e, i) => assertNonNegative(e, ['fuseJ', 'acidJ', 'sulfurJ', 'aidJ'][i] as string))
  const sum = corrections.reduce((a, b) => a + b, 0)
  return (input.energyEquivalentJPerK * input.temperatureRiseK - sum) / input.sampleMassG
}

/** e_fuse (J) = burnt wire length × heat of combustion per unit length — ASTM D240 / D5865 (fuse-wire correction). */
export function fuseCorrectionJ(burntLengthCm: number, jPerCm: number): number {
  assertNonNegative(burntLengthCm, 'burntLengthCm')
  assertNonNegative(jPerCm, 'jPerCm')
  return burntLengthCm * jPerCm
}

/** e_acid (J) = volume of titrant × energy per mL of titrant — ASTM D240 / D5865 (acid correction from the washings titration). */
export function acidCorrectionFromTitrationJ(titrantMl: number, jPerMl: number): number {
  assertNonNegative(titrantMl, 'titrantMl')
  assertNonNegative(jPerMl, 'jPerMl')
  return titrantMl * jPerMl
}

/** Energy per mL of a monoprotic titrant (J/mL) = c (mol/L)/1000 × energy of formation of HNO3 (J/mol) — stoichiometry, 1 mol base ≡ 1 mol HNO3. */
export function titrantJPerMl(titrantMolPerL: number, formationJPerMol: number = NITRIC_ACID_FORMATION_J_PER_MOL): number {
  assertPositive(titrantMolPerL, 'titrantMolPerL')
  assertPositive(formationJPerMol, 'formationJPerMol')
  return (titrantMolPerL / 1000) * formationJPerMol
}

/** e_N (J) = n(HNO3) × energy of formation of aqueous HNO3 (59.7 kJ/mol) — ISO 1928 (from memory). */
export function nitricAcidCorrectionJ(nitricAcidMol: number, formationJPerMol: number = NITRIC_ACID_FORMATION_J_PER_MOL): number {
  assertNonNegative(nitricAcidMol, 'nitricAcidMol')
  assertPositive(formationJPerMol, 'formationJPerMol')
  return nitricAcidMol * formationJPerMol
}

/** e (J) = coefficient (J per % × g) × element (mass-%, analysis sample) × m (g): the shape of the sulfur and chlorine corrections. */
export function elementCorrectionJ(elementPct: number, sampleMassG: number, jPerPctG: number, name: string): number {
  assertNonNegative(elementPct, name)
  if (elementPct > 100) throw new RangeError(`${name} must be at most 100 (got ${elementPct})`)
  assertPositive(sampleMassG, 'sampleMassG')
  assertNonNegative(jPerPctG, 'jPerPctG')
  return jPerPctG * elementPct * sampleMassG
}

/** e_S (J) = 57.5 × S (mass-%, analysis sample) × m (g), after a total-acid titration counted as HNO3 — ASTM D240 / D5865 (from memory). */
export function sulfurCorrectionJ(sulfurPct: number, sampleMassG: number, jPerPctG: number = SULFUR_CORRECTION_J_PER_PCT_G): number {
  return elementCorrectionJ(sulfurPct, sampleMassG, jPerPctG, 'sulfurPct')
}

export interface NetCalorificValueInput {
  /** Gross calorific value at constant volume, dry basis, J/g. */
  grossDryJPerG: number
  /** Hydrogen, dry basis, mass-%, excluding the hydrogen of the moisture. */
  hydrogenDryPct: number
  /** Moisture of the basis wanted (total moisture for as-received), mass-%. */
  moisturePct: number
}

export interface NetCalorificValueConstantPressureInput extends NetCalorificValueInput {
  oxygenDryPct: number
  nitrogenDryPct: number
}

function checkNetInput(input: NetCalorificValueInput): void {
  assertFinite(input.grossDryJPerG, 'grossDryJPerG')
  assertNonNegative(input.hydrogenDryPct, 'hydrogenDryPct')
  assertNonNegative(input.moisturePct, 'moisturePct')
  if (input.moisturePct >= 100) throw new RangeError(`moisturePct must be below 100 (got ${input.moisturePct})`)
}

/** q_p,net = [q_v,gr,d − 212.2·H_d − 0.8(O_d + N_d)](1 − 0.01M) − 24.43M, J/g — ISO 1928 / ISO 18125. */
export function netCalorificValueConstantPressure(input: NetCalorificValueConstantPressureInput): number {
  checkNetInput(input)
  assertNonNegative(input.oxygenDryPct, 'oxygenDryPct')
  assertNonNegative(input.nitrogenDryPct, 'nitrogenDryPct')
  const c = NET_CALORIFIC_COEFFICIENTS
  const dry = input.grossDryJPerG - c.hydrogenConstantPressure * input.hydrogenDryPct
    - c.oxygenNitrogenConstantPressure * (input.oxygenDryPct + input.nitrogenDryPct)
  return dry * (1 - 0.01 * input.moisturePct) - c.moistureConstantPressure * input.moisturePct
}

/** q_v,net = [q_v,gr,d − 206.0·H_d](1 − 0.01M) − 23.05M, J/g — ISO 1928 / ISO 18125. */
export function netCalorificValueConstantVolume(input: NetCalorificValueInput): number {
  checkNetInput(input)
  const c = NET_CALORIFIC_COEFFICIENTS
  const dry = input.grossDryJPerG - c.hydrogenConstantVolume * input.hydrogenDryPct
  return dry * (1 - 0.01 * input.moisturePct) - c.moistureConstantVolume * input.moisturePct
}
