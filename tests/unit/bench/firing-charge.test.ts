import { describe, expect, it } from 'vitest'
import { weighedCharge } from '../../../server/utils/firing'
import { analyseThermogram } from '../../../shared/domain/results'
import { synthesiseThermogram } from './synthetic-thermogram'

// The weighed charge replaces the planned masses before the re-assessment at firing.
describe('weighedCharge', () => {
  it('puts the weighed mass on a single sample and says what changed', () => {
    const out = weighedCharge([{ role: 'sample', massG: 1 }, { role: 'fuse', wire: 'nichrome', lengthCm: 10 }], { outcome: 'complete', weighedMassG: 1.0123, observations: '' })
    expect(out.components[0]!.massG).toBe(1.0123)
    expect(out.components[1]).toEqual({ role: 'fuse', wire: 'nichrome', lengthCm: 10 })
    expect(out.changes).toEqual(['sample mass 1.0000 g planned, 1.0123 g weighed'])
  })

  it('keeps the proportions of several sample components and takes the weighed aid', () => {
    const out = weighedCharge([{ role: 'sample', massG: 0.3 }, { role: 'sample', massG: 0.1 }, { role: 'aid', massG: 0.5 }], { outcome: 'complete', weighedMassG: 0.8, aidMassG: 0.45, observations: '' })
    expect(out.components.map(c => c.massG)).toEqual([0.6000000000000001, 0.2, 0.45].map(x => expect.closeTo(x, 12)))
    expect(out.changes).toHaveLength(2)
  })

  it('reports nothing when the charge was weighed as planned', () => {
    expect(weighedCharge([{ role: 'sample', massG: 1 }], { outcome: 'complete', weighedMassG: 1, observations: '' }).changes).toEqual([])
  })
})

describe('synthetic thermogram of the tests', () => {
  it('is recovered by Regnault–Pfaundler within 0.02 % of the θ built in (as tests/unit/results/thermogram.test.ts)', () => {
    const analysis = analyseThermogram(synthesiseThermogram({ thetaK: 2.6507 }))
    expect(analysis.ok).toBe(true)
    if (!analysis.ok) return
    expect(Math.abs(analysis.regnaultPfaundler.riseK - 2.6507) / 2.6507).toBeLessThan(2e-4)
    expect(analysis.periods.ignitionTimeS).toBe(300)
  })
})
