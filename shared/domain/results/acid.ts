// Acid and sulfur corrections by the convention of the method in force: what was measured decides which energies apply.
import { elementCorrectionJ } from './calorific-value'
import { assertPositive } from './guards'

/**
 * - 'total-acid': the washings titrated for total acid, counted as nitric acid; sulfur then corrected by the difference
 *   between the sulfuric and nitric acid energies (ASTM D240 / D5865 convention).
 * - 'nitric-acid': the nitric acid alone (ion chromatography, or the method's fixed value), sulfur from the analysis
 *   corrected for the formation of H₂SO₄(aq) from SO₂(g) (ISO 1928 convention).
 * - 'nitric-acid-chlorine': as 'nitric-acid', plus the hydrochloric acid from the chlorine of a waste fuel.
 */
export type AcidConvention = 'total-acid' | 'nitric-acid' | 'nitric-acid-chlorine'
export const ACID_CONVENTIONS: readonly AcidConvention[] = ['total-acid', 'nitric-acid', 'nitric-acid-chlorine']

/** Molar mass of sulfur, g/mol — IUPAC standard atomic weight 32.06. */
export const SULFUR_MOLAR_MASS_G_PER_MOL = 32.06
/** Molar mass of chlorine, g/mol — IUPAC standard atomic weight 35.45. */
export const CHLORINE_MOLAR_MASS_G_PER_MOL = 35.45

/** Energy of formation of aqueous H₂SO₄ from SO₂(g), O₂ and water in the vessel, J/mol — ISO 1928 (from memory). */
export const SULFURIC_FROM_SO2_J_PER_MOL = 302_000

/** 1 % S in 1 g of sample is 0.01 g S = 0.01/M_S mol, so the sulfur correction per (% S × g) is E/M_S × 0.01. */
export function sulfurCoefficientJPerPctG(energyJPerMolS: number): number {
  assertPositive(energyJPerMolS, 'energyJPerMolS')
  return (energyJPerMolS / SULFUR_MOLAR_MASS_G_PER_MOL) * 0.01
}

/** ISO convention: 302 kJ/mol ÷ 32.06 g/mol × 0.01 = 94.2 J per (% S × g) — ISO 1928 (from memory). */
export const SULFUR_CORRECTION_ISO_J_PER_PCT_G = Math.round(sulfurCoefficientJPerPctG(SULFURIC_FROM_SO2_J_PER_MOL) * 10) / 10

/**
 * Energy released when HCl(g) dissolves to HCl(aq): ΔfH°(HCl, aq) − ΔfH°(HCl, g) = −167.16 − (−92.31) = −74.85 kJ/mol
 * (NBS tables of chemical thermodynamic properties, 1982; from memory). The lab's policy may set its method's own figure.
 */
export const HCL_SOLUTION_J_PER_MOL = 74_850

/** Chlorine correction per (% Cl × g): 74.85 kJ/mol ÷ 35.45 g/mol × 0.01 = 21.1 J (derivation above; from memory). */
export const CHLORINE_CORRECTION_J_PER_PCT_G = Math.round(((HCL_SOLUTION_J_PER_MOL / CHLORINE_MOLAR_MASS_G_PER_MOL) * 0.01) * 10) / 10

/** Which convention what was measured implies: a titration is total acid; a nitric acid figure is the ISO way; nothing → policy. */
export function acidConventionOf(measured: { titration: boolean, nitricAcid: boolean, chlorine: boolean }, policyConvention: AcidConvention): AcidConvention {
  if (measured.titration) return 'total-acid'
  if (measured.chlorine) return 'nitric-acid-chlorine'
  if (measured.nitricAcid) return policyConvention === 'nitric-acid-chlorine' ? 'nitric-acid-chlorine' : 'nitric-acid'
  return policyConvention
}

/** J per (% S × g) the convention applies to the sulfur of the analysis sample. */
export function sulfurCoefficientFor(convention: AcidConvention, totalAcidJPerPctG: number): number {
  return convention === 'total-acid' ? totalAcidJPerPctG : SULFUR_CORRECTION_ISO_J_PER_PCT_G
}

/** e_Cl (J) = c_Cl × Cl (mass-%, analysis sample) × m (g). */
export function chlorineCorrectionJ(chlorinePct: number, sampleMassG: number, jPerPctG: number = CHLORINE_CORRECTION_J_PER_PCT_G): number {
  return elementCorrectionJ(chlorinePct, sampleMassG, jPerPctG, 'chlorinePct')
}

/** Words the certificate and the result page use for a convention. */
export const ACID_CONVENTION_TEXT: Readonly<Record<AcidConvention, string>> = {
  'total-acid': 'Total acid by titration of the washings, counted as nitric acid; sulfur corrected at 57.5 J per (% S × g) (ASTM D5865 / ASTM D240).',
  'nitric-acid': 'Nitric acid determined on its own; sulfur from the analysis corrected for the formation of sulfuric acid from sulfur dioxide, 302 kJ/mol = 94.2 J per (% S × g) (ISO 1928).',
  'nitric-acid-chlorine': 'Nitric acid determined on its own; sulfur from the analysis at 94.2 J per (% S × g) (ISO 1928); chlorine corrected for the hydrochloric acid formed.',
}

/** The convention in words with what decided it: what was measured in the washings, else the lab policy. */
export function acidConventionWords(c: { acidConvention: AcidConvention, acidMeasured?: string }): string {
  const text = ACID_CONVENTION_TEXT[c.acidConvention]
  return c.acidMeasured === 'not measured' ? `No acid figure was entered, so the lab policy's convention applies (acid correction 0 J). ${text}` : text
}
