// The day plan's speed on a generated lab of 50 vessels and 500 samples (1,000 runs): the charge assessment of every
// run on every vessel (what the server computes, duplicates sharing one charge), then the heuristic itself.
import { assessCharge, type ChargeInput } from '../shared/domain/assessment'
import { proposeDay, type AssessOn } from '../shared/domain/day-plan'
import { DEFAULT_POLICY } from '../shared/domain/policy'
import { randomLab, seeded } from '../tests/support/day-plan-lab'

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]!

export function benchDayPlan(vesselCount = 50, sampleCount = 500, rounds = 5) {
  const rand = seeded(20261203)
  const { vessels, runs } = randomLab(rand, vesselCount, sampleCount)
  // Each vessel a rating between 25 and 40 kJ, each sample a coal charge between 0.6 and 1.5 g: some pairs block.
  const ratings = new Map(vessels.map(v => [v.id, 25000 + rand() * 15000]))
  const masses = new Map(Array.from({ length: sampleCount }, (_, i) => [`s${i}`, 0.6 + rand() * 0.9]))
  const charge = (massG: number, ratedEnergyJ: number): ChargeInput => ({
    vessel: { ratedEnergyJ, maxChargeMassG: 1.5, maxFillPressureMPa: 4.05, volumeMl: 300, class: 'standard', name: 'bench' },
    fillPressureMPa: 3.0,
    components: [
      { role: 'sample', massG, composition: { C: 72.1, H: 4.9, N: 1.4, S: 0.9, O: 8.2, ash: 9.5, moisture: 3.0, basis: 'as-received' } },
      { role: 'fuse', wire: 'nichrome', lengthCm: 10 },
    ],
  })
  const assessTimes: number[] = []
  const planTimes: number[] = []
  let placed = 0
  for (let r = 0; r < rounds; r++) {
    const t0 = performance.now()
    const verdicts = new Map<string, ReturnType<AssessOn>>()
    for (const [sampleId, m] of masses) {
      for (const v of vessels) {
        const a = assessCharge(charge(m, ratings.get(v.id)!), DEFAULT_POLICY)
        verdicts.set(`${sampleId}|${v.id}`, { verdict: a.verdict, reason: a.findings.find(f => f.severity === 'block')?.message })
      }
    }
    const t1 = performance.now()
    const p = proposeDay(vessels, runs, (run, v) => verdicts.get(`${run.sampleId}|${v.id}`)!, { dayStart: new Date('2026-12-03T08:00:00Z'), workdayMinutes: 480, cycleMinutes: 20 })
    const t2 = performance.now()
    assessTimes.push(t1 - t0)
    planTimes.push(t2 - t1)
    placed = p.vessels.reduce((n, v) => n + v.firings.filter(f => f.runId).length, 0)
  }
  return { assessMs: median(assessTimes), planMs: median(planTimes), placed, runs: runs.length, vesselCount, sampleCount, rounds }
}

if (import.meta.url === `file://${process.argv[1]}`) console.log(benchDayPlan())
