import { describe, expect, it } from 'vitest'
import { as, call } from '../support/api'
import { testDb } from '../support/db'
import { fire, readyRuns, registerVessel } from '../unit/bench/bench-api'

// The daily tally of firings (vessel_firing_days) is kept by triggers on firings. These tests move firings in time with
// plain SQL, the way a bulk load or a correction by a database administrator would, and compare the tally, the fleet's
// forecast window and the vessel's weekly chart with counts taken from the firings themselves. The arithmetic is
// counting only; the day boundaries are UTC days (ISO 8601 weeks for the chart).

const DAY_MS = 86_400_000

async function tallyOf(vesselId: string) {
  const { rows } = await testDb().query(`select to_char(day, 'YYYY-MM-DD') as day, firings from vessel_firing_days where vessel_id = $1 and firings > 0 order by day`, [vesselId])
  return rows as { day: string, firings: number }[]
}

async function countedOf(vesselId: string) {
  const { rows } = await testDb().query(
    `select to_char((fired_at at time zone 'UTC')::date, 'YYYY-MM-DD') as day, count(*)::int as firings from firings where vessel_id = $1 group by 1 order by 1`, [vesselId])
  return rows as { day: string, firings: number }[]
}

async function forecastOf(vesselId: string) {
  const res = await call('GET', '/api/fleet', { cookie: await as('technician') })
  expect(res.status).toBe(200)
  return res.body.vessels.find((v: { id: string }) => v.id === vesselId).forecast as { firingsInWindow: number }
}

describe('daily firing tally', () => {
  it('follows firings recorded, moved in time and removed, and the forecast window counts the first day exactly', async () => {
    // Registered 60 days ago, so the forecast window is the full 28 days.
    const v = await registerVessel({ serviceIntervalFirings: 400 })
    await testDb().query(`update vessels set registered_at = now() - interval '60 days' where id = $1`, [v.id])
    const runs = await readyRuns(v.id, Array.from({ length: 6 }, () => ({})))
    for (const r of runs) expect((await fire(r.id)).status).toBe(201)
    expect(await tallyOf(v.id)).toEqual(await countedOf(v.id))
    expect((await forecastOf(v.id)).firingsInWindow).toBe(6)

    const ids = (await testDb().query(`select id from firings where vessel_id = $1 order by fired_at`, [v.id])).rows.map(r => r.id as string)
    const windowStart = Date.now() - 28 * DAY_MS
    // Half an hour inside and half an hour outside the 28-day window: the boundary falls inside a UTC day, which the
    // tally alone cannot split; 10 and 40 days back lie well inside and well outside.
    const moves: [string, number][] = [[ids[0]!, windowStart + 30 * 60_000], [ids[1]!, windowStart - 30 * 60_000], [ids[2]!, Date.now() - 10 * DAY_MS], [ids[3]!, Date.now() - 40 * DAY_MS]]
    for (const [id, at] of moves) await testDb().query(`update firings set fired_at = $2 where id = $1`, [id, new Date(at)])
    expect(await tallyOf(v.id)).toEqual(await countedOf(v.id))
    const inWindow = (await testDb().query(`select count(*)::int as n from firings where vessel_id = $1 and fired_at >= now() - interval '28 days'`, [v.id])).rows[0].n
    expect(inWindow).toBe(4)
    expect((await forecastOf(v.id)).firingsInWindow).toBe(4)

    // The weekly chart (26 ISO weeks up to this one) adds up to the firings of those weeks.
    const chart = await call('GET', `/api/vessels/${v.id}/firings`, { cookie: await as('technician') })
    expect(chart.status).toBe(200)
    const firstWeek = chart.body.weekly[0].weekStart as string
    const inChart = (await testDb().query(`select count(*)::int as n from firings where vessel_id = $1 and fired_at >= $2::date`, [v.id, firstWeek])).rows[0].n
    expect(chart.body.weekly.reduce((s: number, w: { firings: number }) => s + w.firings, 0)).toBe(inChart)
    expect(inChart).toBe(6)

    // A removal (tried inside a transaction that is rolled back: firings carry results and audit references).
    const client = await testDb().connect()
    try {
      await client.query('begin')
      await client.query(`delete from firings where id = $1`, [ids[2]])
      const { rows } = await client.query(`select firings from vessel_firing_days where vessel_id = $1 and day = ($2::timestamptz at time zone 'UTC')::date`, [v.id, new Date(moves[2]![1])])
      expect(rows[0].firings).toBe(0)
      await client.query('rollback')
    }
    finally { client.release() }
    expect(await tallyOf(v.id)).toEqual(await countedOf(v.id))
  })
})
