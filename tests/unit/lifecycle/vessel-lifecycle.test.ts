import { describe, expect, it } from 'vitest'
import { checkRunEffect, firingEffect, lockOutReason } from '../../../shared/domain/vessel-lifecycle'

// What a firing and a check run do to a vessel (common practice: a leak or an overpressure event takes the
// vessel out of use until it is requalified; after a service a passing check run returns it to service).
describe('firingEffect', () => {
  it('counts every firing once and locks out after a leak or an overpressure event', () => {
    expect(firingEffect('complete')).toEqual({ counts: 1, lockOut: false, givesResult: true })
    expect(firingEffect('misfire')).toEqual({ counts: 1, lockOut: false, givesResult: false })
    expect(firingEffect('leak').lockOut).toBe(true)
    expect(firingEffect('overpressure').lockOut).toBe(true)
  })

  it('writes the lock-out reason with who, when and what', () => {
    expect(lockOutReason({ outcome: 'overpressure', sampleCode: 'S-9', seq: 3, firedByName: 'Mira', at: new Date('2026-12-01T10:20:00Z'), observations: 'bang' }))
      .toBe('Overpressure event on firing of S-9 (run #3) recorded by Mira on 2026-12-01 10:20 UTC: bang. Requalify the vessel before any further firing.')
  })
})

describe('checkRunEffect', () => {
  const waiting = { name: 'V1', condition: 'awaiting-verification' }
  it('returns a vessel awaiting verification to service on a pass only', () => {
    const pass = checkRunEffect(waiting, 'CHK-1', { passed: true, deviationPct: 0.05, tolerancePct: 0.3 })
    expect(pass.returnedToService).toBe(true)
    expect(pass.reason).toBe('Check run CHK-1 agreed with the certified value within 0.050 % (tolerance ± 0.30 %).')
    expect(checkRunEffect(waiting, 'CHK-2', { passed: false, deviationPct: 0.8, tolerancePct: 0.3 }).returnedToService).toBe(false)
  })

  it('changes nothing on a vessel in normal service', () => {
    expect(checkRunEffect({ name: 'V1', condition: 'normal' }, 'CHK-3', { passed: true, deviationPct: 0, tolerancePct: 0.3 })).toMatchObject({ returnedToService: false, reason: null })
  })
})
