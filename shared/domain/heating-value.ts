// Heating value of each component: declared, estimated from composition, or a conservative policy value.
import { type Composition, toDryBasis } from './composition'
import type { LabPolicy } from './policy'

export type HeatingValueSource = 'declared' | 'material' | 'correlation' | 'element-oxide' | 'policy-fallback' | 'fuse-wire' | 'cotton'
export type WireType = 'nichrome' | 'iron' | 'platinum' | 'cotton'

export type CorrelationField = 'C' | 'H' | 'O' | 'N' | 'S' | 'ash'

/** Validity ranges of the correlation, dry mass-% (Channiwala & Parikh 2002, Fuel 81:1051). */
export const CHANNIWALA_PARIKH_RANGES: Readonly<Record<CorrelationField, readonly [number, number]>> = {
  C: [0, 92.25],
  H: [0.43, 25.15],
  O: [0, 50],
  N: [0, 5.6],
  S: [0, 94.08],
  ash: [0, 71.4],
}

/** Mean absolute error of the correlation over its data set, % (Channiwala & Parikh 2002). */
export const CHANNIWALA_PARIKH_MEAN_ABSOLUTE_ERROR_PCT = 1.45

export interface RangeViolation {
  field: CorrelationField
  value: number
  min: number
  max: number
}

export interface CorrelationEstimate {
  /** Dry-basis HHV, MJ/kg. */
  hhvDryMJPerKg: number
  /** HHV of the component as fired, J/g: HHV_d·(1 − M/100). */
  hhvAsFiredJPerG: number
  violations: RangeViolation[]
  dry: Composition
}

/** HHV (MJ/kg, dry) = 0.3491C + 1.1783H + 0.1005S − 0.1034O − 0.0151N − 0.0211A (Channiwala & Parikh 2002, Fuel 81:1051). */
export function channiwalaParikhMJPerKg(dry: Composition): number {
  return (
    0.3491 * (dry.C ?? 0)
    + 1.1783 * (dry.H ?? 0)
    + 0.1005 * (dry.S ?? 0)
    - 0.1034 * (dry.O ?? 0)
    - 0.0151 * (dry.N ?? 0)
    - 0.0211 * (dry.ash ?? 0)
  )
}

/** Fields of a dry composition outside the correlation's validity ranges (Channiwala & Parikh 2002, Fuel 81:1051). */
export function correlationRangeViolations(dry: Composition): RangeViolation[] {
  const out: RangeViolation[] = []
  for (const field of Object.keys(CHANNIWALA_PARIKH_RANGES) as CorrelationField[]) {
    const [min, max] = CHANNIWALA_PARIKH_RANGES[field]
    const value = dry[field] ?? 0
    if (value < min || value > max) out.push({ field, value, min, max })
  }
  return out
}

/** HHV as fired from composition: dry basis by ASTM D3180, HHV_ar = HHV_d·(1 − M/100) (Channiwala & Parikh 2002). */
export function heatingValueFromComposition(c: Composition): CorrelationEstimate {
  const dry = toDryBasis(c)
  const hhvDryMJPerKg = channiwalaParikhMJPerKg(dry)
  const moisture = dry.moisture ?? 0
  return {
    hhvDryMJPerKg,
    // Never clipped: a result at or below zero says the correlation does not fit, and the caller falls back.
    hhvAsFiredJPerG: hhvDryMJPerKg * 1000 * (1 - moisture / 100),
    violations: correlationRangeViolations(dry),
    dry,
  }
}

/** Energy of a burnt fuse wire, J = length × J/cm of its type (policy values; from memory: nickel-chromium 9.6, iron 11.3). */
export function fuseWireEnergyJ(lengthCm: number, wire: Exclude<WireType, 'cotton'>, policy: LabPolicy): number {
  return lengthCm * policy.fuseWireJPerCm[wire]
}

/** Energy of a cotton thread, J = mass × policy J/g (about 17.5 kJ/g, from memory). */
export function cottonEnergyJ(massG: number, policy: LabPolicy): number {
  return massG * policy.cottonJPerG
}

export interface HeatingValueInput {
  heatingValueJPerG?: number | undefined
  heatingValueFrom?: 'declared' | 'material' | undefined
  composition?: Composition | undefined
  /** Composition derived from a formula or structure, used after a measured composition. */
  derivedComposition?: Composition | undefined
}

export interface HeatingValueChoice {
  jPerG: number
  source: HeatingValueSource
  /** Where the composition came from when the correlation was used. */
  compositionFrom?: 'given' | 'derived' | undefined
  estimate?: CorrelationEstimate | undefined
  /** Why the policy value was used although something was known. */
  fallbackReason?: string | undefined
}

/**
 * Heating value in this order: declared value → Channiwala & Parikh from a measured composition →
 * from a formula- or structure-derived composition → the conservative policy value.
 */
export function chooseHeatingValue(input: HeatingValueInput, policy: LabPolicy): HeatingValueChoice {
  if (input.heatingValueJPerG !== undefined) {
    return { jPerG: input.heatingValueJPerG, source: input.heatingValueFrom === 'material' ? 'material' : 'declared' }
  }
  for (const [composition, from] of [[input.composition, 'given'], [input.derivedComposition, 'derived']] as const) {
    if (composition === undefined) continue
    const estimate = heatingValueFromComposition(composition)
    if (estimate.hhvAsFiredJPerG <= 0) {
      return { jPerG: policy.fallbackHeatingValueJPerG, source: 'policy-fallback', estimate, fallbackReason: `the correlation gives ${Math.round(estimate.hhvAsFiredJPerG)} J/g, which is not a heating value` }
    }
    return { jPerG: estimate.hhvAsFiredJPerG, source: 'correlation', compositionFrom: from, estimate }
  }
  return { jPerG: policy.fallbackHeatingValueJPerG, source: 'policy-fallback' }
}
