// Small factories for charge-assessment tests: a typical vessel, components, and a seeded random source.
import type { ChargeInput, ResolvedComponent, VesselInput } from '#shared/domain/assessment'
import { DEFAULT_POLICY, type LabPolicy } from '#shared/domain/policy'

// Typical vessel: ≈ 33 kJ rating, 40 atm (4.053 MPa) maximum fill, 300 mL.
// The 1.5 g maximum charge is a test fixture, not a check value.
export function makeVessel(overrides: Partial<VesselInput> = {}): VesselInput {
  return { ratedEnergyJ: 33000, maxChargeMassG: 1.5, maxFillPressureMPa: 4.053, volumeMl: 300, class: 'standard', name: 'T-1', ...overrides }
}

export function sample(massG: number | undefined, extra: Partial<ResolvedComponent> = {}): ResolvedComponent {
  return massG === undefined ? { role: 'sample', ...extra } : { role: 'sample', massG, ...extra }
}

export function aid(massG: number, extra: Partial<ResolvedComponent> = {}): ResolvedComponent {
  return { role: 'aid', massG, ...extra }
}

export function nichromeFuse(lengthCm = 10): ResolvedComponent {
  return { role: 'fuse', wire: 'nichrome', lengthCm }
}

/** What the library vouches for a shipped reference material (its classification; no decomposition record). */
export const REFERENCE_IDENTITY = { name: 'benzoic acid', classification: 'reference standard, shipped reference material' }

// Benzoic acid certified value, weighed in air (NIST SRM 39j certificate).
export const BENZOIC_ACID_J_PER_G = 26454

export function benzoicAcid(massG: number): ResolvedComponent {
  return sample(massG, { heatingValueJPerG: BENZOIC_ACID_J_PER_G, name: 'benzoic acid', library: REFERENCE_IDENTITY })
}

export function makeCharge(components: ResolvedComponent[], overrides: Partial<ChargeInput> = {}): ChargeInput {
  return { vessel: makeVessel(), fillPressureMPa: 3.0, components, ...overrides }
}

export function policyWith(overrides: Partial<LabPolicy>): LabPolicy {
  return { ...DEFAULT_POLICY, ...overrides }
}

/** Deterministic pseudo-random numbers in [0, 1) (mulberry32), so property tests repeat exactly. */
export function seededRandom(seed: number): () => number {
  let a = seed >>> 0
  return () => {
    a = (a + 0x6D2B79F5) >>> 0
    let t = a
    t = Math.imul(t ^ (t >>> 15), t | 1)
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61)
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296
  }
}
