// The counting rules checked here (every firing adds one to each counter; a routine service resets
// the service counter, a requalification both); the figures are small invented counts, checked by plain arithmetic.
import { describe, expect, it } from 'vitest'
import { formatReconciliation, reconcile, reconcileVessel, type VesselCounts } from '#shared/reconcile'

function vessel(over: Partial<VesselCounts> = {}): VesselCounts {
  return {
    id: 'v1',
    name: 'KR-9 Test',
    firingsTotal: 1210,
    firingsTotalAtRegistration: 1200,
    firingsSinceService: 60,
    firingsSinceRequalification: 410,
    firings: 10,
    registered: { firingsSinceService: 50, firingsSinceRequalification: 400 },
    lastServiceReset: null,
    lastRequalificationReset: null,
    ...over,
  }
}

const check = (r: ReturnType<typeof reconcileVessel>, counter: string) => r.checks.find(c => c.counter === counter)!

describe('reconcileVessel', () => {
  it('accepts counters that equal the registration baseline plus every firing recorded', () => {
    const r = reconcileVessel(vessel())
    expect(r.mismatches).toEqual([])
    // 1200 + 10 = 1210; 50 + 10 = 60; 400 + 10 = 410.
    expect(check(r, 'lifetime').expected).toBe(1210)
    expect(check(r, 'since-service').expected).toBe(60)
    expect(check(r, 'since-requalification').expected).toBe(410)
    expect(r.notes).toEqual([])
  })

  it('finds a firing without its counter increment, and a counter increment without its firing', () => {
    const lost = reconcileVessel(vessel({ firings: 11 }))
    expect(lost.mismatches.map(m => [m.counter, m.recorded, m.expected])).toEqual([
      ['lifetime', 1210, 1211], ['since-service', 60, 61], ['since-requalification', 410, 411],
    ])
    const extra = reconcileVessel(vessel({ firingsTotal: 1211 }))
    expect(extra.mismatches.map(m => [m.counter, m.recorded, m.expected])).toEqual([['lifetime', 1211, 1210]])
  })

  it('counts the service counter from the last reset, and the requalification counter from the last requalification', () => {
    const r = reconcileVessel(vessel({
      firingsSinceService: 3,
      firingsSinceRequalification: 7,
      lastServiceReset: { at: '2026-11-20T09:00:00.000Z', kind: 'routine service', firingsAfter: 3 },
      lastRequalificationReset: { at: '2026-11-01T09:00:00.000Z', firingsAfter: 7 },
    }))
    expect(r.mismatches).toEqual([])
    expect(check(r, 'since-service').basis).toBe('3 firings after the routine service of 2026-11-20T09:00:00.000Z')
    // A counter that was not reset by the record (still 60) is caught.
    const stale = reconcileVessel(vessel({ lastServiceReset: { at: '2026-11-20T09:00:00.000Z', kind: 'routine service', firingsAfter: 3 } }))
    expect(stale.mismatches.map(m => [m.counter, m.recorded, m.expected])).toEqual([['since-service', 60, 3]])
  })

  it('compares only the lifetime counter when no record gives the service baselines, and says so', () => {
    const r = reconcileVessel(vessel({ registered: null, firingsSinceService: 999, firingsSinceRequalification: 999 }))
    expect(r.mismatches).toEqual([])
    expect(check(r, 'since-service').expected).toBeNull()
    expect(r.notes.join(' ')).toMatch(/only the lifetime counter is compared/)
    // The lifetime counter is still checked.
    expect(reconcileVessel(vessel({ registered: null, firings: 9 })).mismatches.map(m => m.counter)).toEqual(['lifetime'])
  })

  it('notes service records loaded as history, which reset nothing', () => {
    expect(reconcileVessel(vessel({ historyRecords: 2 })).notes).toEqual(['2 service records loaded as history without resetting the counters (no counters in their audit row), so not counted as a reset'])
  })
})

describe('reconcile and its report', () => {
  it('says "all N vessels reconcile" when every counter agrees', () => {
    const r = reconcile([vessel(), vessel({ id: 'v2', name: 'KR-10' })])
    expect(r.ok).toBe(true)
    expect(formatReconciliation(r)).toBe('all 2 vessels reconcile: every counter equals the firings recorded')
  })

  it('lists every counter that disagrees in a table with its difference and basis', () => {
    const r = reconcile([vessel(), vessel({ id: 'v2', name: 'KR-10 Broken', firingsTotal: 1208 })])
    expect(r.ok).toBe(false)
    expect(r.mismatched.map(v => v.name)).toEqual(['KR-10 Broken'])
    const text = formatReconciliation(r)
    expect(text.split('\n')[0]).toBe('1 vessel of 2 does not reconcile:')
    expect(text).toMatch(/KR-10 Broken\s+lifetime\s+1208\s+1210\s+-2\s+1200 at registration \+ 10 firings recorded/)
    expect(text).not.toMatch(/KR-9 Test/)
  })
})
