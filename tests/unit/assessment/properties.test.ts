import { describe, expect, it } from 'vitest'
import { type Assessment, assessCharge, type ChargeInput, type ResolvedComponent } from '#shared/domain/assessment'
import { DEFAULT_POLICY } from '#shared/domain/policy'
import { makeCharge, makeVessel, nichromeFuse, sample, seededRandom } from './factories'

const P = DEFAULT_POLICY
const CASES = 300

function randomSample(random: () => number, massG: number): ResolvedComponent {
  // Half the samples carry a composition (a coal-to-biomass spread), half a declared heating value.
  if (random() < 0.5) {
    const parts = { C: 40 + random() * 40, H: 3 + random() * 4, N: random() * 2, S: random() * 2, O: 5 + random() * 35, ash: random() * 15, moisture: random() * 10 }
    const sum = Object.values(parts).reduce((a, b) => a + b, 0)
    const k = (99 + random()) / sum // scaled to 99–100 % so every composition is valid
    return sample(massG, { composition: Object.fromEntries(Object.entries(parts).map(([key, v]) => [key, v * k])) })
  }
  return sample(massG, { heatingValueJPerG: 5000 + random() * 40000 })
}

function randomCharge(random: () => number): ChargeInput {
  const components: ResolvedComponent[] = [randomSample(random, 0.05 + random() * 1.4)]
  if (random() < 0.3) components.push({ role: 'aid', massG: random() * 0.3, heatingValueJPerG: 26454 })
  if (random() < 0.7) components.push(nichromeFuse(5 + random() * 10))
  return makeCharge(components, {
    vessel: makeVessel({ volumeMl: 250 + random() * 100 }),
    fillPressureMPa: 0.5 + random() * 3.5,
    temperatureC: 18 + random() * 10,
  })
}

function scaleSamples(input: ChargeInput, k: number): ChargeInput {
  return { ...input, components: input.components.map(c => (c.role === 'sample' && c.massG !== undefined ? { ...c, massG: c.massG * k } : c)) }
}

describe('properties over random charges (seeded)', () => {
  it('heat release is linear in the sample mass', () => {
    const random = seededRandom(1928)
    for (let i = 0; i < CASES; i++) {
      const input = randomCharge(random)
      const k = 0.2 + random() * 1.5
      const base = assessCharge(input, P)
      const scaled = assessCharge(scaleSamples(input, k), P)
      const fixed = (a: Assessment) => a.components.filter((_, j) => input.components[j]?.role !== 'sample').reduce((s, c) => s + c.heatReleaseJ, 0)
      expect(scaled.heatReleaseJ - fixed(scaled)).toBeCloseTo(k * (base.heatReleaseJ - fixed(base)), 6)
    }
  })

  it('more oxygen never lowers the excess', () => {
    const random = seededRandom(61)
    for (let i = 0; i < CASES; i++) {
      const input = randomCharge(random)
      const low = assessCharge(input, P)
      const high = assessCharge({ ...input, fillPressureMPa: input.fillPressureMPa + random() * 1.5 }, P)
      expect(high.oxygenAvailableMol).toBeGreaterThanOrEqual(low.oxygenAvailableMol)
      if (low.oxygenExcess !== null && high.oxygenExcess !== null) expect(high.oxygenExcess).toBeGreaterThanOrEqual(low.oxygenExcess)
    }
  })

  it('adding a component never lowers the heat release', () => {
    const random = seededRandom(1051)
    for (let i = 0; i < CASES; i++) {
      const input = randomCharge(random)
      const extra = random() < 0.5 ? randomSample(random, random() * 0.5) : nichromeFuse(random() * 15)
      const before = assessCharge(input, P)
      const after = assessCharge({ ...input, components: [...input.components, extra] }, P)
      expect(after.heatReleaseJ).toBeGreaterThanOrEqual(before.heatReleaseJ)
    }
  })

  it('the suggested maximum sample mass raises none of the mass-dependent blocks', () => {
    const random = seededRandom(144)
    const massBlocks = ['energy-over-rating', 'mass-over-maximum', 'oxygen-insufficient', 'peak-over-proof']
    for (let i = 0; i < CASES; i++) {
      const input = randomCharge(random)
      const max = assessCharge(input, P).suggestions.maxSampleMassG
      if (max === null || max <= 0) continue
      const atMax = assessCharge({ ...input, components: input.components.map(c => (c.role === 'sample' ? { ...c, massG: max } : c)) }, P)
      expect(atMax.findings.map(f => f.code).filter(c => massBlocks.includes(c))).toEqual([])
    }
  })

  it('the verdict is the worst severity of the findings', () => {
    const random = seededRandom(7)
    for (let i = 0; i < CASES; i++) {
      const a = assessCharge(randomCharge(random), P)
      const severities = new Set(a.findings.map(f => f.severity))
      expect(a.verdict).toBe(severities.has('block') ? 'blocked' : severities.has('approval') ? 'needs-approval' : 'clear')
    }
  })
})
