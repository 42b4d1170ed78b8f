import { describe, expect, it } from 'vitest'
import { as, call, signIn, unique } from '../support/api'
import { auditRows } from '../support/db'
import { BA_J_PER_G, FUSE_10CM_J, PASSWORD, benzoicAcidId, enterResult, fire, readyRuns, registerVessel, standardisedVessel } from '../unit/bench/bench-api'

// Standardisation. ε = (m_BA·q_BA + e_fuse + e_acid + e_aid)/θ (ASTM D240 §8; ISO 1928) with q_BA = 26 454 J/g
// (NIST SRM 39j, weighed in air); series mean, s and RSD = 100·s/mean (JCGM 100:2008 §4.2); acceptance by the policy
// defaults (ISO 1928: five runs, RSD ≤ 0.20 %, from memory); Shewhart limits ±2σ/±3σ and rule 1 (ISO 7870-2).

async function stdResults(vesselId: string, epsilons: number[], acidJ = 0) {
  const ba = await benzoicAcidId()
  const runs = await readyRuns(vesselId, epsilons.map(() => ({ sampleCode: unique('STD'), kind: 'standardisation' as const, materialId: ba, massG: 1 })))
  const results = []
  for (const [i, r] of runs.entries()) {
    await fire(r.id, { weighedMassG: 1 })
    const theta = (BA_J_PER_G + FUSE_10CM_J + acidJ) / epsilons[i]!
    const body: Record<string, unknown> = { temperatureRiseK: theta, fuse: { wire: 'nichrome', burntLengthCm: 10 } }
    if (acidJ) body.acid = { titrantMl: acidJ / 4.33, titrantJPerMl: 4.33 }
    const res = await enterResult(r.id, body)
    expect(res.status, JSON.stringify(res.body)).toBe(201)
    results.push(res.body.result)
  }
  return results
}

const accept = async (vesselId: string, resultIds: string[], cookie?: string, password = PASSWORD) =>
  call('POST', `/api/vessels/${vesselId}/energy-equivalent`, { cookie: cookie ?? await as('supervisor'), body: { resultIds, password, reason: 'series checked' } })

describe('energy equivalent of a standardisation run', () => {
  it('is (m·q + e_fuse + e_acid)/θ of each run (ASTM D240 §8)', async () => {
    const v = await registerVessel()
    // 8.5 mL of 0.0725 mol/L titrant ≈ 36.8 J (ASTM D240 alkali, 59.7 kJ/mol HNO3 — from memory), given as 4.33 J/mL.
    const [r] = await stdResults(v.id, [10_010], 8.5 * 4.33)
    expect(r.values.energyEquivalentJPerK).toBeCloseTo(10_010, 6)
    expect(r.values.energyReleasedJ).toBeCloseTo(BA_J_PER_G + FUSE_10CM_J + 8.5 * 4.33, 6)
    expect(r.values.certifiedValueJPerG).toBe(BA_J_PER_G)
  })
})

describe('accepting a series', () => {
  it('accepts five runs within the RSD limit: mean, s and RSD as JCGM 100:2008 §4.2; the older ε stops being used', async () => {
    const eps = [10_012, 10_004, 10_009, 10_001, 10_006]
    const first = await standardisedVessel()
    const results = await stdResults(first.vessel.id, eps)
    const res = await accept(first.vessel.id, results.map(r => r.id))
    expect(res.status).toBe(201)
    const mean = eps.reduce((a, b) => a + b, 0) / 5 // 10 006.4 J/K
    const s = Math.sqrt(eps.reduce((a, e) => a + (e - mean) ** 2, 0) / 4) // 4.28 J/K
    expect(res.body.energyEquivalent.valueJPerK).toBeCloseTo(mean, 6)
    expect(res.body.energyEquivalent.standardDeviationJPerK).toBeCloseTo(s, 6)
    expect(res.body.energyEquivalent.relativeStandardDeviationPct).toBeCloseTo((100 * s) / mean, 8)
    const history = await call('GET', `/api/vessels/${first.vessel.id}/energy-equivalent`, { cookie: await as('technician') })
    expect(history.body.history.map((h: { active: boolean }) => h.active)).toEqual([true, false])
    expect(history.body.active.id).toBe(res.body.energyEquivalent.id)
    const [row] = await auditRows({ action: 'energy-equivalent.accept', entityId: first.vessel.id, since: new Date(Date.now() - 60_000) }).then(rows => rows.slice(-1))
    expect(row.reason).toBe('series checked')
    // The same runs cannot make a second series.
    const reused = await accept(first.vessel.id, results.map(r => r.id))
    expect(reused.status).toBe(409)
    expect(reused.body.message).toMatch(/Already part of an accepted series/)
  })

  it('refuses too few runs, an RSD above the limit, the wrong results, the wrong role and a wrong password', async () => {
    const v = await registerVessel()
    const four = await stdResults(v.id, [10_000, 10_002, 9_998, 10_001])
    const few = await accept(v.id, four.map(r => r.id))
    expect(few.status).toBe(409)
    expect(few.body.message).toMatch(/Only 4 runs; the method needs at least 5/)
    // s = 41.2 J/K on a mean of 10 000 J/K: RSD 0.41 %, above 0.20 %.
    const wide = await stdResults(v.id, [10_000, 10_050, 9_950, 10_030, 9_970])
    const rsd = await accept(v.id, wide.map(r => r.id))
    expect(rsd.status).toBe(409)
    expect(rsd.body.message).toMatch(/relative standard deviation is 0\.412 %, above the limit of 0\.200 %/)
    const other = await registerVessel()
    const wrongVessel = await accept(other.id, four.map(r => r.id))
    expect(wrongVessel.status).toBe(422)
    expect(wrongVessel.body.data.fields[0].path).toBe('resultIds.0')
    expect((await accept(v.id, four.map(r => r.id), await as('analyst'))).status).toBe(403)
    expect((await accept(v.id, four.map(r => r.id), undefined, 'wrong-password')).status).toBe(403)
    const missing = await call('POST', `/api/vessels/${v.id}/energy-equivalent`, { cookie: await as('supervisor'), body: { resultIds: [four[0].id] } })
    expect(missing.status).toBe(422)
    expect(missing.body.data.fields.map((f: { path: string }) => f.path).sort()).toEqual(['password', 'reason', 'resultIds'])
  })

  it('refuses a supervisor who fired runs of the series (separation of duties)', async () => {
    const email = `${unique('both')}@emberline.test`
    await call('POST', '/api/admin/users', { cookie: await as('admin'), body: { email, name: 'Bo Both', roles: ['analyst', 'supervisor'], password: 'both-roles-2026!' } })
    const both = await signIn(email, 'both-roles-2026!')
    const v = await registerVessel()
    const ba = await benzoicAcidId()
    const runs = await readyRuns(v.id, [0, 1, 2, 3, 4].map(() => ({ kind: 'standardisation' as const, materialId: ba, massG: 1 })), both)
    const ids = []
    for (const r of runs) {
      await fire(r.id, { weighedMassG: 1 }, { cookie: both })
      ids.push((await enterResult(r.id, { temperatureRiseK: (BA_J_PER_G + FUSE_10CM_J) / 10_000, fuse: { wire: 'nichrome', burntLengthCm: 10 } }, both)).body.result.id)
    }
    const res = await accept(v.id, ids, both, 'both-roles-2026!')
    expect(res.status).toBe(403)
    expect(res.body.message).toMatch(/separation of duties/)
  })
})

describe('control chart of ε', () => {
  it('draws the limits of the accepted series and flags a point beyond +3σ (ISO 7870-2 test 1)', async () => {
    const s = await standardisedVessel([10_000, 10_005, 9_995, 10_002, 9_998])
    const sigma = Math.sqrt((0 + 25 + 25 + 4 + 4) / 4) // 3.808 J/K, the accepted series' s
    await stdResults(s.vessel.id, [10_000 + 4 * sigma])
    const res = await call('GET', `/api/standardisation/${s.vessel.id}`, { cookie: await as('technician') })
    expect(res.status).toBe(200)
    const chart = res.body.charts.energyEquivalent
    expect(chart.ok).toBe(true)
    expect(chart.limits.centre).toBeCloseTo(10_000, 9)
    expect(chart.limits.upperWarning).toBeCloseTo(10_000 + 2 * sigma, 9)
    expect(chart.limits.lowerAction).toBeCloseTo(10_000 - 3 * sigma, 9)
    expect(chart.points).toHaveLength(6)
    expect(chart.points[5].zone).toBe('beyond-action')
    expect(chart.outOfControl).toBe(true)
    expect(chart.violations[0]).toMatch(/Point 6 .* lies above the upper action limit/)
    // The new run is offered as the start of the next series.
    expect(res.body.candidate.resultIds).toHaveLength(1)
  })
})
