import { describe, expect, it } from 'vitest'
import { DEFAULT_POLICY } from '../../../shared/domain/policy'
import { checkRunEffect, correctionEffect, firingEffect, LifecycleRefusal, lockOutReason, serviceEffect } from '../../../shared/domain/vessel-lifecycle'
import { serviceInputSchema } from '../../../shared/schemas/services'
import type { ServiceInput } from '../../../shared/schemas/services'

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

// Service rules (common practice, vessel service guidance): all seals renewed together with a leak test under water and
// an electrode check; a routine service resets the service counter, a requalification both; after any service only
// standardisation or check runs until a check passes.
describe('serviceEffect', () => {
  const normal = { condition: 'normal', conditionReason: null }
  const routine = (over: Record<string, unknown> = {}) => serviceInputSchema.parse({
    kind: 'routine', performedAt: '2026-11-30T10:00:00Z', password: 'x',
    seals: [{ position: 'head', name: 'Head O-ring', renewed: true }, { position: 'valve', name: 'Valve seal', renewed: true }, { position: 'electrode', name: 'Electrode seal', renewed: true }],
    valveSeatRenewed: true, electrodeInsulators: 'inspected', packingNutTorqueNm: 12, electrodeResistanceOhm: 1.2,
    leakTest: { passed: true, pressureMPa: 3 }, sealingSurfaces: 'good', threads: 'good', ...over,
  }) as ServiceInput
  const allowed = { ok: false, why: '' }

  it('resets the service counter and waits for a check run after a routine service that passed its checks', () => {
    expect(serviceEffect(normal, routine(), DEFAULT_POLICY, allowed)).toMatchObject({ reset: 'service', condition: 'awaiting-verification', checksPassed: true })
  })

  it('locks the vessel out after a failed leak test or an electrode resistance above the limit (5 Ω policy)', () => {
    expect(serviceEffect(normal, routine({ leakTest: { passed: false, pressureMPa: 3, where: 'valve' } }), DEFAULT_POLICY, allowed)).toMatchObject({ condition: 'locked-out', lockCause: 'service-check' })
    expect(serviceEffect(normal, routine({ electrodeResistanceOhm: 7 }), DEFAULT_POLICY, allowed)).toMatchObject({ condition: 'locked-out', lockCause: 'service-check' })
    expect(serviceEffect(normal, routine({ threads: 'corroded' }), DEFAULT_POLICY, allowed)).toMatchObject({ condition: 'locked-out', lockCause: 'damage' })
  })

  it('keeps a lock-out after an overpressure until the return to service is signed', () => {
    const locked = { condition: 'locked-out', conditionReason: 'Overpressure event on firing' }
    expect(serviceEffect(locked, routine(), DEFAULT_POLICY, allowed)).toMatchObject({ reset: 'service', condition: 'locked-out', reason: 'Overpressure event on firing' })
  })

  it('refuses records the vessel\'s condition does not allow', () => {
    const ret = { kind: 'return-to-service', performedAt: '2026-11-30T10:00:00Z', password: 'x', reason: 'requalified' } as ServiceInput
    expect(() => serviceEffect({ condition: 'retired', conditionReason: null }, routine(), DEFAULT_POLICY, allowed)).toThrow(LifecycleRefusal)
    expect(() => serviceEffect(normal, ret, DEFAULT_POLICY, allowed)).toThrow('Only a locked-out vessel is returned to service.')
    expect(() => serviceEffect({ condition: 'locked-out', conditionReason: 'leak' }, ret, DEFAULT_POLICY, { ok: false, why: 'No passing requalification since the lock-out.' })).toThrow('No passing requalification')
  })

  it('a correction never lifts a condition or resets a counter', () => {
    expect(correctionEffect({ condition: 'awaiting-verification', conditionReason: 'serviced' }, routine(), DEFAULT_POLICY)).toMatchObject({ reset: null, condition: 'awaiting-verification' })
  })
})
