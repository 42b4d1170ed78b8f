import { describe, expect, it } from 'vitest'
import { dayCapacity, forecastWithPlans, layoutDay, proposeDay, refusal } from '../../../shared/domain/day-plan'
import type { AssessOn } from '../../../shared/domain/day-plan'
import { DAY, randomLab, runsFor, seeded, vessel } from '../../support/day-plan-lab'

// Defaults of the lab policy: a firing cycle of 20 min, a bench day of 8 h (the lab's own estimates).
const S = { dayStart: DAY, workdayMinutes: 480, cycleMinutes: 20 }
const clear: AssessOn = () => ({ verdict: 'clear' })

describe('day plan rules', () => {
  it('fits 24 firing cycles of 20 min in an 8 h day and ends each vessel on the clock', () => {
    // 480 min / 20 min = 24 cycles (arithmetic).
    expect(dayCapacity(vessel({ id: 'A' }), S).firings).toBe(24)
    const p = proposeDay([vessel({ id: 'A' })], runsFor(3), clear, S)
    expect(p.vessels[0]!.firings).toHaveLength(6)
    // Six cycles of 20 min from 08:00 → 10:00 UTC.
    expect(p.vessels[0]!.endsAt!.toISOString()).toBe('2026-12-03T10:00:00.000Z')
  })

  it('never crosses a service limit: a vessel with 6 firings left gets at most 6', () => {
    const p = proposeDay([vessel({ id: 'A', firingsUntilService: 6 })], runsFor(5), clear, S)
    expect(p.vessels[0]!.firings).toHaveLength(6)
    expect(p.vessels[0]!.firingsLeftAfter).toBe(0)
    expect(p.leftovers).toHaveLength(4)
    expect(p.leftovers[0]!.reason).toMatch(/full that day — A: 6 firings left before routine service/)
  })

  it('stops at a calendar service date that falls inside the day', () => {
    const v = vessel({ id: 'A', serviceDueAt: new Date('2026-12-03T09:00:00Z') })
    // 08:00 → 09:00 is three cycles of 20 min.
    expect(dayCapacity(v, S)).toMatchObject({ firings: 3 })
  })

  it('gives nothing to a blocked vessel and says why', () => {
    const locked = vessel({ id: 'L', blocksAllFirings: true, blocksSampleRuns: true, stateReason: 'The vessel is locked out' })
    const p = proposeDay([locked, vessel({ id: 'A' })], runsFor(2), clear, S)
    expect(p.vessels.find(v => v.vesselId === 'L')!.firings).toEqual([])
    expect(p.vessels.find(v => v.vesselId === 'L')!.note).toMatch(/takes nothing that day: The vessel is locked out/)
  })

  it('starts with a check run where one is needed, and fires only that on a vessel awaiting verification', () => {
    const stale = vessel({ id: 'A', firstNeeds: { kind: 'check', firings: 1, reason: 'energy equivalent from 40 days ago' } })
    const serviced = vessel({ id: 'B', blocksSampleRuns: true, stateReason: 'awaiting check run', firstNeeds: { kind: 'check', firings: 1, reason: 'serviced' } })
    const p = proposeDay([stale, serviced], runsFor(2), clear, S)
    const a = p.vessels.find(v => v.vesselId === 'A')!
    expect(a.firings[0]).toMatchObject({ runId: null, kind: 'check', order: 1 })
    expect(a.firings.slice(1).map(f => f.runId)).toEqual(['s0-d0', 's0-d1', 's1-d0', 's1-d1'])
    expect(p.vessels.find(v => v.vesselId === 'B')!.firings.map(f => f.kind)).toEqual(['check'])
  })

  it('keeps the duplicates of one sample on one vessel and spreads samples across vessels', () => {
    const p = proposeDay([vessel({ id: 'A' }), vessel({ id: 'B' })], runsFor(4), clear, S)
    for (const v of p.vessels) {
      const samples = v.firings.map(f => f.runId!.split('-')[0])
      expect(samples).toHaveLength(4)
      expect(samples[0]).toBe(samples[1])
      expect(samples[2]).toBe(samples[3])
    }
    expect(p.vessels[0]!.firings[0]!.why).toMatch(/All 2 determinations on A/)
  })

  it('leaves a run blocked on every vessel in the queue with the assessment\'s reason', () => {
    const assess: AssessOn = run => (run.sampleId === 's1' ? { verdict: 'blocked', reason: 'heat release above the rating' } : { verdict: 'clear' })
    const p = proposeDay([vessel({ id: 'A' })], runsFor(2), assess, S)
    expect(p.leftovers.map(l => l.runId)).toEqual(['s1-d0', 's1-d1'])
    expect(p.leftovers[0]!.reason).toMatch(/No chosen vessel may fire it — blocked on A: heat release above the rating/)
  })

  it('re-checks a move at once: onto a blocked vessel, or past a limit, is a problem', () => {
    const assess: AssessOn = (run, v) => (v.id === 'B' && run.sampleId === 's0' ? { verdict: 'blocked', reason: 'mass above the maximum' } : { verdict: 'clear' })
    const vs = [vessel({ id: 'A' }), vessel({ id: 'B', firingsUntilService: 1 })]
    const runs = runsFor(2)
    const moved = layoutDay(vs, runs, { A: ['s1-d0', 's1-d1'], B: ['s0-d0', 's0-d1'] }, assess, S)
    expect(moved.problems.map(p => p.message)).toEqual(['KR-2026-00000/1: blocked on B: mass above the maximum', 'KR-2026-00000/2: blocked on B: mass above the maximum'])
    const over = layoutDay(vs, runs, { A: ['s0-d0', 's0-d1'], B: ['s1-d0', 's1-d1'] }, assess, S)
    expect(over.problems.map(p => p.message)).toEqual(['KR-2026-00001/2: B has 1 firing that day (1 firing left before routine service)'])
    expect(layoutDay(vs, runs, { A: ['s0-d0', 's0-d1', 's1-d0'], B: ['s1-d1'] }, assess, S).problems).toEqual([])
  })

  it('forecasts the service day from planned firings, or the calendar when that comes first', () => {
    const due = new Date('2026-12-20T00:00:00Z')
    const days = [3, 4, 5].map(d => ({ day: new Date(`2026-12-0${d}T00:00:00Z`), firings: 20 }))
    // 50 firings left: 20 + 20 = 40 after Thursday the 4th, 60 after Friday the 5th → due Friday.
    expect(forecastWithPlans(50, due, days)).toEqual({ dueAt: new Date('2026-12-05T00:00:00Z'), by: 'firings' })
    expect(forecastWithPlans(500, due, days)).toEqual({ dueAt: due, by: 'calendar' })
  })
})

describe('property: generated labs of 5–50 vessels and 10–500 samples', () => {
  it('never assigns a run to a vessel its assessment blocks, never beyond a vessel\'s firings, and places or explains every run', () => {
    const rand = seeded(20261203)
    for (let lab = 0; lab < 40; lab++) {
      const nv = 5 + Math.floor(rand() * 46)
      const ns = 10 + Math.floor(rand() * 491)
      const { vessels, runs, assessOn } = randomLab(rand, nv, ns)
      const p = proposeDay(vessels, runs, assessOn, S)
      expect(p.problems, `lab ${lab}`).toEqual([])
      const byId = new Map(vessels.map(v => [v.id, v]))
      const runById = new Map(runs.map(r => [r.id, r]))
      let placed = 0
      for (const vd of p.vessels) {
        const v = byId.get(vd.vesselId)!
        expect(vd.firings.length).toBeLessThanOrEqual(Math.max(0, Math.min(v.firingsUntilService, v.firingsUntilRequalification, 24)))
        for (const f of vd.firings) {
          if (!f.runId) continue
          placed++
          expect(refusal(runById.get(f.runId)!, v, assessOn), `${f.runId} on ${v.id}`).toBeNull()
          expect(assessOn(runById.get(f.runId)!, v).verdict).not.toBe('blocked')
        }
      }
      expect(placed + p.leftovers.length).toBe(runs.length)
      for (const l of p.leftovers) expect(l.reason.length).toBeGreaterThan(10)
    }
  })
})
