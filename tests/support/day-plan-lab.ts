// Generated labs for the day plan: vessels in every state and queues of duplicate samples, from a seeded generator.
import type { AssessOn, PlanRun, PlanVessel } from '../../shared/domain/day-plan'

export { seeded } from './seeded'

export const DAY = new Date('2026-12-03T08:00:00Z')

export function vessel(over: Partial<PlanVessel> & { id: string }): PlanVessel {
  return {
    name: over.id, blocksAllFirings: false, blocksSampleRuns: false, stateReason: 'in service', firingsUntilService: 400,
    firingsUntilRequalification: 4000, serviceDueAt: new Date('2027-03-01T00:00:00Z'), firstNeeds: null, ...over,
  }
}

export function runsFor(samples: number, determinations = 2, kindOf: (i: number) => PlanRun['kind'] = () => 'sample'): PlanRun[] {
  return Array.from({ length: samples }, (_, i) => Array.from({ length: determinations }, (_, d) => ({
    id: `s${i}-d${d}`, sampleId: `s${i}`, label: `KR-2026-${String(i).padStart(5, '0')}/${d + 1}`, kind: kindOf(i), priority: i * 1000,
  }))).flat()
}

/** A random lab: a mix of usable, nearly-due, awaiting-verification and blocked vessels; some samples too energetic for some vessels. */
export function randomLab(rand: () => number, vesselCount: number, sampleCount: number) {
  const vessels = Array.from({ length: vesselCount }, (_, i) => {
    const r = rand()
    const id = `V${String(i).padStart(2, '0')}`
    if (r < 0.1) return vessel({ id, blocksAllFirings: true, blocksSampleRuns: true, stateReason: 'locked out', firingsUntilService: 0 })
    if (r < 0.2) return vessel({ id, blocksSampleRuns: true, stateReason: 'awaiting check run', firstNeeds: { kind: 'check', firings: 1, reason: 'serviced' } })
    if (r < 0.4) return vessel({ id, firingsUntilService: 1 + Math.floor(rand() * 6) })
    if (r < 0.5) return vessel({ id, firstNeeds: { kind: 'check', firings: 1, reason: 'energy equivalent older than 30 days' } })
    return vessel({ id, firingsUntilService: 20 + Math.floor(rand() * 400) })
  })
  const runs = runsFor(sampleCount, 2)
  // Blocked pairs: about one in six (sample, vessel) combinations — as a charge too large for a small vessel would be.
  const blocked = new Set<string>()
  for (let s = 0; s < sampleCount; s++) for (const v of vessels) if (rand() < 1 / 6) blocked.add(`s${s}|${v.id}`)
  const assessOn: AssessOn = (run, v) => (blocked.has(`${run.sampleId}|${v.id}`) ? { verdict: 'blocked', reason: 'energy over rating' } : { verdict: (run.priority / 1000) % 7 === 3 ? 'needs-approval' : 'clear' })
  return { vessels, runs, assessOn }
}
