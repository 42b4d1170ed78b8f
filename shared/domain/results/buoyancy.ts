// Air buoyancy: a mass weighed in air against steel weights, expressed as a mass in vacuum.
import { assertPositive } from './guards'

export interface BuoyancyDensities {
  /** Density of air at the balance, g/mL (0.0012 g/mL, the conventional value of OIML R 111; from memory). */
  airGPerMl: number
  /** Density of the substance weighed, g/mL (benzoic acid 1.32 g/mL; handbook value, from memory). */
  substanceGPerMl: number
  /** Density of the weights, g/mL (8.0 g/mL, the conventional value of OIML R 111; from memory). */
  weightsGPerMl: number
}

export const DEFAULT_BUOYANCY_DENSITIES: BuoyancyDensities = { airGPerMl: 0.0012, substanceGPerMl: 1.32, weightsGPerMl: 8.0 }

/** m_vacuum / m_air = (1 − ρ_air/ρ_weights) / (1 − ρ_air/ρ_substance) — the buoyancy equation of weighing (textbook). */
export function buoyancyFactor(d: BuoyancyDensities): number {
  assertPositive(d.airGPerMl, 'airGPerMl')
  assertPositive(d.substanceGPerMl, 'substanceGPerMl')
  assertPositive(d.weightsGPerMl, 'weightsGPerMl')
  if (d.airGPerMl >= d.substanceGPerMl || d.airGPerMl >= d.weightsGPerMl) throw new RangeError('air must be lighter than the substance and the weights')
  return (1 - d.airGPerMl / d.weightsGPerMl) / (1 - d.airGPerMl / d.substanceGPerMl)
}

/** The certificate's in-vacuum value per gram weighed in air: q_air = q_vacuum × m_vacuum/m_air. */
export function valuePerMassWeighedInAir(certifiedInVacuumJPerG: number, d: BuoyancyDensities): number {
  assertPositive(certifiedInVacuumJPerG, 'certifiedInVacuumJPerG')
  return certifiedInVacuumJPerG * buoyancyFactor(d)
}
