// The pickers' search: GET /api/materials?q=&limit= finds any material of a large library, not only the first page.
import { beforeAll, describe, expect, it } from 'vitest'
import { as, call, unique } from '../support/api'

const tag = unique('Lot')
let targetId = ''

beforeAll(async () => {
  const sup = await as('supervisor')
  // More than 200 materials, so that the old "first 200" picker could never have offered the target.
  for (let batch = 0; batch < 21; batch++) {
    await Promise.all(Array.from({ length: 10 }, (_, i) => call('POST', '/api/materials', {
      cookie: sup,
      body: { name: `${tag} filler ${String(batch * 10 + i).padStart(3, '0')}`, category: 'coal', heatingValueJPerG: 25000 },
    }).then(r => expect(r.status).toBe(201))))
  }
  // "Zz" sorts after every filler and every shipped material: past the 200th by name.
  const target = await call('POST', '/api/materials', { cookie: sup, body: { name: `Zz ${tag} Target Pellet`, category: 'chemical', formula: 'C10H8' } })
  expect(target.status).toBe(201)
  targetId = target.body.id
}, 120_000)

describe('material search', () => {
  it('finds a material past the 200th of the library, case-insensitively, by part of its name', async () => {
    const cookie = await as('analyst')
    const first200 = await call('GET', '/api/materials?pageSize=200&derived=0', { cookie })
    expect(first200.body.total).toBeGreaterThan(200)
    expect(first200.body.rows.map((m: { id: string }) => m.id)).not.toContain(targetId)

    const hit = await call('GET', `/api/materials?q=${encodeURIComponent(`${tag} target`.toUpperCase())}&limit=5&derived=0`, { cookie })
    expect(hit.status).toBe(200)
    expect(hit.body.rows.map((m: { id: string }) => m.id)).toEqual([targetId])
  })

  it('matches the formula and puts names that start with the words first', async () => {
    const cookie = await as('analyst')
    const byFormula = await call('GET', '/api/materials?q=c10h8&limit=50&derived=0', { cookie })
    expect(byFormula.body.rows.map((m: { id: string }) => m.id)).toContain(targetId)
    const prefix = await call('GET', `/api/materials?q=${encodeURIComponent(tag)}&limit=3&derived=0`, { cookie })
    expect(prefix.body.rows.every((m: { name: string }) => m.name.startsWith(tag))).toBe(true)
  })

  it('answers the limit asked for, at most 50, with the number of all matches', async () => {
    const cookie = await as('technician')
    const dflt = await call('GET', `/api/materials?q=${encodeURIComponent(tag)}&limit=20&derived=0`, { cookie })
    expect(dflt.body.rows).toHaveLength(20)
    expect(dflt.body.total).toBe(211)
    const most = await call('GET', `/api/materials?q=${encodeURIComponent(tag)}&limit=50&derived=0`, { cookie })
    expect(most.body.rows).toHaveLength(50)
  })

  it('refuses a limit out of range or not a number, naming the field', async () => {
    const cookie = await as('analyst')
    for (const bad of ['51', '0', 'ten']) {
      const res = await call('GET', `/api/materials?q=coal&limit=${bad}`, { cookie })
      expect(res.status).toBe(422)
      expect(res.body.data.fields.map((f: { path: string }) => f.path)).toEqual(['limit'])
    }
    const longQ = await call('GET', `/api/materials?q=${'x'.repeat(101)}&limit=5`, { cookie })
    expect(longQ.status).toBe(422)
    expect(longQ.body.data.fields[0].path).toBe('q')
  })

  it('reads the materials a page names by id, and refuses an id that is not one', async () => {
    const cookie = await as('analyst')
    const byId = await call('GET', `/api/materials?ids=${targetId}&derived=0`, { cookie })
    expect(byId.body.rows.map((m: { name: string }) => m.name)).toEqual([`Zz ${tag} Target Pellet`])
    const bad = await call('GET', '/api/materials?ids=not-an-id', { cookie })
    expect(bad.status).toBe(422)
    expect(bad.body.data.fields[0].path).toMatch(/^ids/)
  })

  it('answers 401 without a session', async () => {
    expect((await call('GET', '/api/materials?q=coal&limit=5')).status).toBe(401)
  })
})
