import { describe, expect, it } from 'vitest'
import { as, call } from '../support/api'
import { fire, readyRuns, registerVessel } from '../unit/bench/bench-api'

// GET /api/fleet: the service forecast counts the firings recorded in its window. The rate arithmetic is
// plain counting (firings per day × 7); the interval figures are the test's own vessel settings.

async function forecastOf(vesselId: string) {
  const res = await call('GET', '/api/fleet', { cookie: await as('technician') })
  expect(res.status).toBe(200)
  return res.body.vessels.find((v: { id: string }) => v.id === vesselId).forecast as { firingsInWindow: number, windowDays: number, firingsPerWeek: number, serviceDueForecastAt: string | null, decidedBy: string }
}

describe('fleet forecast after firings today', () => {
  it('counts 14 firings recorded today and lets the firing rate bring the service date forward', async () => {
    // 100 firings per service: 14 today leave 86; at 14 a day that is about 6 days, well before the 182-day calendar date.
    const v = await registerVessel({ serviceIntervalFirings: 100 })
    const quiet = await registerVessel({ serviceIntervalFirings: 100 })
    expect((await forecastOf(v.id)).firingsInWindow).toBe(0)
    const runs = await readyRuns(v.id, Array.from({ length: 14 }, () => ({})))
    for (const r of runs) expect((await fire(r.id)).status).toBe(201)

    const f = await forecastOf(v.id)
    expect(f.firingsInWindow).toBe(14)
    // A vessel registered today: the window is its one day of life, so 14 firings/day = 98 firings/week.
    expect(f.windowDays).toBe(1)
    expect(f.firingsPerWeek).toBe(98)
    expect(f.decidedBy).toBe('firings')
    const days = (new Date(f.serviceDueForecastAt!).getTime() - Date.now()) / 86_400_000
    expect(days).toBeGreaterThan(86 / 14 - 0.5)
    expect(days).toBeLessThan(86 / 14 + 0.5)
    // Another vessel's firings are not counted for it.
    const other = await forecastOf(quiet.id)
    expect(other.firingsInWindow).toBe(0)
    expect(other.decidedBy).toBe('calendar')
  })
})
