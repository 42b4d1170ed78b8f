import { describe, expect, it } from 'vitest'
import {
  DEFAULT_REQUALIFICATION_INTERVAL_FIRINGS,
  DEFAULT_SERVICE_INTERVAL_DAYS,
  DEFAULT_SERVICE_INTERVAL_FIRINGS,
  computeVesselState,
  forecastServiceDate,
  type VesselState,
  type VesselStateInput,
} from '../../shared/domain/vessel-state'

// Intervals: routine service every 500 firings or six months (182 days), requalification after 5,000 firings —
// common practice (manufacturers' service guidance) "Due" margin 10 % — lab policy default.
const DAY = 86_400_000
const REGISTERED = new Date('2024-01-02T00:00:00Z')
const SERVICED = new Date('2025-01-01T08:00:00Z')
const after = (from: Date, days: number) => new Date(from.getTime() + days * DAY)

const vessel = (over: Partial<VesselStateInput> = {}): VesselStateInput => ({
  firingsSinceService: 0,
  firingsSinceRequalification: 0,
  firingsTotal: 0,
  lastServicedAt: SERVICED,
  registeredAt: REGISTERED,
  serviceIntervalFirings: DEFAULT_SERVICE_INTERVAL_FIRINGS,
  serviceIntervalDays: DEFAULT_SERVICE_INTERVAL_DAYS,
  requalificationIntervalFirings: DEFAULT_REQUALIFICATION_INTERVAL_FIRINGS,
  condition: 'normal',
  now: after(SERVICED, 10),
  dueMarginPct: 10,
  ...over,
})
const fired = (n: number, over: Partial<VesselStateInput> = {}) =>
  vessel({ firingsSinceService: n, firingsSinceRequalification: n, firingsTotal: n, ...over })
const stateOf = (input: VesselStateInput) => computeVesselState(input).state

describe('defaults (common practice, manufacturers’ service guidance)', () => {
  it('500 firings, 182 days, 5,000 firings', () => {
    expect([DEFAULT_SERVICE_INTERVAL_FIRINGS, DEFAULT_SERVICE_INTERVAL_DAYS, DEFAULT_REQUALIFICATION_INTERVAL_FIRINGS]).toEqual([500, 182, 5000])
  })
})

describe('firing-count boundaries', () => {
  it.each<[number, VesselState]>([
    [0, 'in-service'],
    [449, 'in-service'],
    [450, 'service-due'], // 90 % of 500
    [499, 'service-due'],
    [500, 'overdue'],
    [501, 'overdue'],
  ])('%i firings since service → %s', (n, state) => {
    expect(stateOf(fired(n))).toBe(state)
  })

  it('counts firings left, negative once past', () => {
    expect(computeVesselState(fired(449)).firingsUntilService).toBe(51)
    expect(computeVesselState(fired(500)).firingsUntilService).toBe(0)
    expect(computeVesselState(fired(503)).firingsUntilService).toBe(-3)
  })

  it('says why, with the numbers', () => {
    expect(computeVesselState(fired(452)).reasons).toEqual([
      'Routine service is due soon: 452 firings since the last routine service, 48 left before the interval of 500.',
    ])
    expect(computeVesselState(fired(500)).reasons).toEqual([
      'Routine service is overdue: 500 firings since the last routine service, the interval is 500.',
    ])
  })
})

describe('calendar boundaries', () => {
  it.each<[number, VesselState]>([
    [163, 'in-service'],
    [163.79, 'in-service'],
    [163.8, 'service-due'], // 90 % of 182 days
    [181, 'service-due'],
    [181.99, 'service-due'],
    [182, 'overdue'],
    [400, 'overdue'],
  ])('day %d since service → %s', (days, state) => {
    expect(stateOf(vessel({ now: after(SERVICED, days) }))).toBe(state)
  })

  it('due date = last service + 182 days, days left rounded up, negative once past', () => {
    const at = (days: number) => computeVesselState(vessel({ now: after(SERVICED, days) }))
    expect(at(0).serviceDueAt.toISOString()).toBe('2025-07-02T08:00:00.000Z')
    expect(at(181).daysUntilService).toBe(1)
    expect(at(181.5).daysUntilService).toBe(1)
    expect(at(182).daysUntilService).toBe(0)
    expect(Object.is(at(182).daysUntilService, -0)).toBe(false)
    expect(at(185).daysUntilService).toBe(-3)
  })

  it('says why, with the numbers and the date', () => {
    expect(computeVesselState(vessel({ now: after(SERVICED, 170) })).reasons).toEqual([
      'Routine service is due soon: 170 days since the last routine service, due by 2025-07-02 (12 days left).',
    ])
    expect(computeVesselState(vessel({ now: after(SERVICED, 183) })).reasons).toEqual([
      'Routine service is overdue: 183 days since the last routine service (due 2025-07-02), the interval is 182 days.',
    ])
  })

  it('whichever comes first: firings or days', () => {
    expect(stateOf(fired(10, { now: after(SERVICED, 182) }))).toBe('overdue')
    expect(stateOf(fired(500, { now: after(SERVICED, 1) }))).toBe('overdue')
    expect(computeVesselState(fired(500, { now: after(SERVICED, 190) })).reasons).toHaveLength(2)
  })

  it('a vessel never serviced counts from its registration', () => {
    const s = computeVesselState(vessel({ lastServicedAt: null, now: after(REGISTERED, 182) }))
    expect(s.state).toBe('overdue')
    expect(s.serviceDueAt.toISOString()).toBe('2024-07-02T00:00:00.000Z')
    expect(s.reasons[0]).toContain('since registration (no service recorded)')
  })
})

describe('requalification boundaries', () => {
  it('4,999 firings since requalification is not yet due; 5,000 is', () => {
    const before = computeVesselState(vessel({ firingsSinceRequalification: 4999, firingsTotal: 12_000 }))
    expect(before.state).toBe('in-service')
    expect(before.firingsUntilRequalification).toBe(1)
    expect(before.reasons).toContain('Requalification is due in 1 firing (4,999 of 5,000).')
    const reached = computeVesselState(vessel({ firingsSinceRequalification: 5000, firingsTotal: 12_000 }))
    expect(reached.state).toBe('requalification-due')
    expect(reached.firingsUntilRequalification).toBe(0)
    expect(reached.reasons[0]).toBe('5,000 firings since the last requalification reach the requalification interval of 5,000; requalify the vessel before any further firing.')
  })
})

describe('precedence: retired > locked-out > away > requalification-due > overdue > awaiting-verification > service-due > in-service', () => {
  const worst = { firingsSinceService: 600, firingsSinceRequalification: 5200, firingsTotal: 9000, now: after(SERVICED, 300) }

  it.each<[VesselStateInput['condition'], VesselState]>([
    ['retired', 'retired'],
    ['locked-out', 'locked-out'],
    ['away', 'away'],
    ['awaiting-verification', 'requalification-due'],
    ['normal', 'requalification-due'],
  ])('condition %s with every counter past its limit → %s', (condition, state) => {
    expect(stateOf(vessel({ ...worst, condition }))).toBe(state)
  })

  it('overdue outranks awaiting verification, and both reasons show', () => {
    const s = computeVesselState(fired(500, { condition: 'awaiting-verification' }))
    expect(s.state).toBe('overdue')
    expect(s.reasons[1]).toBe('The vessel has been serviced and awaits verification: only standardisation or check runs until a check run passes.')
  })

  it('awaiting verification outranks service due', () => {
    expect(stateOf(fired(460, { condition: 'awaiting-verification' }))).toBe('awaiting-verification')
  })

  it('a locked-out vessel still reports its counters', () => {
    const s = computeVesselState(fired(500, { condition: 'locked-out' }))
    expect(s.reasons).toEqual([
      'The vessel is locked out; it cannot be fired until it has been requalified.',
      'Routine service is overdue: 500 firings since the last routine service, the interval is 500.',
    ])
  })

  it('in service says how much is left', () => {
    expect(computeVesselState(fired(100)).reasons).toEqual([
      'In service: 400 firings and 172 days until the next routine service (due by 2025-07-02).',
    ])
  })
})

describe('what each state blocks', () => {
  it.each<[VesselStateInput, VesselState, boolean, boolean]>([
    [fired(10), 'in-service', false, false],
    [fired(460), 'service-due', false, false],
    [fired(10, { condition: 'awaiting-verification' }), 'awaiting-verification', true, false],
    [fired(500), 'overdue', true, true],
    [vessel({ firingsSinceRequalification: 5000 }), 'requalification-due', true, true],
    [fired(10, { condition: 'away' }), 'away', true, true],
    [fired(10, { condition: 'locked-out' }), 'locked-out', true, true],
    [fired(10, { condition: 'retired' }), 'retired', true, true],
  ])('%#: %s', (input, state, blocksSampleRuns, blocksAllFirings) => {
    expect(computeVesselState(input)).toMatchObject({ state, blocksSampleRuns, blocksAllFirings })
  })
})

describe('margin policy and input checks', () => {
  it('a 20 % margin makes service due from 400 firings', () => {
    expect(stateOf(fired(399, { dueMarginPct: 20 }))).toBe('in-service')
    expect(stateOf(fired(400, { dueMarginPct: 20 }))).toBe('service-due')
  })

  it('defaults the margin to 10 %', () => {
    const input = fired(450)
    delete input.dueMarginPct
    expect(stateOf(input)).toBe('service-due')
  })

  it('refuses impossible inputs', () => {
    expect(() => computeVesselState(fired(-1))).toThrow(RangeError)
    expect(() => computeVesselState(fired(1.5))).toThrow(RangeError)
    expect(() => computeVesselState(vessel({ serviceIntervalFirings: 0 }))).toThrow(RangeError)
    expect(() => computeVesselState(vessel({ now: new Date('not a date') }))).toThrow(RangeError)
    expect(() => computeVesselState(vessel({ dueMarginPct: 100 }))).toThrow(RangeError)
  })
})

describe('forecastServiceDate', () => {
  it('firings left / recent rate, when that comes before the calendar date', () => {
    const s = computeVesselState(fired(400)) // 100 firings left, evaluated 10 days after service
    expect(forecastServiceDate(s, 10).toISOString()).toBe(after(SERVICED, 20).toISOString())
  })

  it('the calendar date when the firing count would reach the interval later', () => {
    const s = computeVesselState(fired(400))
    expect(forecastServiceDate(s, 0.5).toISOString()).toBe(s.serviceDueAt.toISOString()) // 200 days > 172 left
    expect(forecastServiceDate(s, 0).toISOString()).toBe(s.serviceDueAt.toISOString())
  })

  it('now, when the firing interval is already reached', () => {
    const s = computeVesselState(fired(520))
    expect(forecastServiceDate(s, 3).toISOString()).toBe(after(SERVICED, 10).toISOString())
  })

  it('refuses a negative rate', () => {
    expect(() => forecastServiceDate(computeVesselState(fired(1)), -1)).toThrow(RangeError)
  })
})
