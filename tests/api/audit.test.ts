import { beforeAll, describe, expect, it } from 'vitest'
import { as, baseURL, call } from '../support/api'
import { apiRoutes } from '../support/routes'

// A reason that a spreadsheet would run as a formula, holding a comma and quotes besides.
const TRICKY_REASON = '=HYPERLINK("http://example.test","open"), checked by "QA"'

/** RFC 4180 reader, enough to check what the export writes (quoted fields, doubled quotes, CRLF). */
function parseCsv(text: string): string[][] {
  const rows: string[][] = []
  let row: string[] = []
  let field = ''
  let quoted = false
  for (let i = 0; i < text.length; i++) {
    const c = text[i]!
    if (quoted) {
      if (c === '"' && text[i + 1] === '"') { field += '"'; i++ }
      else if (c === '"') quoted = false
      else field += c
    }
    else if (c === '"') quoted = true
    else if (c === ',') { row.push(field); field = '' }
    else if (c === '\r' && text[i + 1] === '\n') { row.push(field); rows.push(row); row = []; field = ''; i++ }
    else field += c
  }
  if (field || row.length) { row.push(field); rows.push(row) }
  return rows
}

const isoDay = (d: Date) => d.toISOString().slice(0, 10)

let admin: { id: string, name: string }
let since: Date
let until: Date

beforeAll(async () => {
  const cookie = await as('admin')
  const users = await call('GET', '/api/admin/users', { cookie })
  admin = users.body.find((u: any) => u.email === 'admin@emberline.test')
  since = new Date(Date.now() - 1000)
  // Two audited changes that change nothing in force: the policy value is written back as it is.
  const settings = await call('GET', '/api/settings', { cookie })
  const waterMl = settings.body.policy.waterMl
  for (const reason of [TRICKY_REASON, 'second check of the audit filters']) {
    const res = await call('PATCH', '/api/settings', { cookie, body: { policy: { waterMl }, reason } })
    expect(res.status).toBe(200)
  }
  until = new Date(Date.now() + 1000)
})

describe('GET /api/audit', () => {
  it('answers newest first with rows, total, page and pageSize', async () => {
    const res = await call('GET', '/api/audit', { cookie: await as('supervisor') })
    expect(res.status).toBe(200)
    expect(res.body).toMatchObject({ page: 1, pageSize: 50 })
    expect(res.body.total).toBeGreaterThanOrEqual(res.body.rows.length)
    // The total is exact below 10,000 matches; beyond that the answer says it is a lower bound.
    expect(res.body.totalIsCapped).toBe(false)
    const times = res.body.rows.map((r: any) => Date.parse(r.at))
    expect(times).toEqual([...times].sort((a, b) => b - a))
    expect(res.body.rows[0]).toEqual(expect.objectContaining({ id: expect.any(String), action: expect.any(String), entity: expect.any(String) }))
  })

  it('filters by entity and entity id', async () => {
    const res = await call('GET', '/api/audit?entity=lab-settings&entityId=1', { cookie: await as('supervisor') })
    expect(res.status).toBe(200)
    expect(res.body.rows.length).toBeGreaterThanOrEqual(2)
    for (const r of res.body.rows) expect([r.entity, r.entityId]).toEqual(['lab-settings', '1'])
    const none = await call('GET', '/api/audit?entity=lab-settings&entityId=2', { cookie: await as('supervisor') })
    expect(none.body).toMatchObject({ rows: [], total: 0 })
  })

  it('filters by the actor\'s user id or any part of the name, ignoring case', async () => {
    const cookie = await as('supervisor')
    const byId = await call('GET', `/api/audit?actor=${admin.id}`, { cookie })
    expect(byId.body.rows.length).toBeGreaterThanOrEqual(2)
    for (const r of byId.body.rows) expect(r.actorId).toBe(admin.id)
    const part = admin.name.split(' ').at(-1)!.slice(1, 5).toUpperCase()
    const byName = await call('GET', `/api/audit?actor=${encodeURIComponent(part)}`, { cookie })
    expect(byName.body.total).toBe(byId.body.total)
    for (const r of byName.body.rows) expect(r.actorName.toUpperCase()).toContain(part)
    // LIKE wildcards in the search text match literally.
    expect((await call('GET', '/api/audit?actor=%25', { cookie })).body.total).toBe(0)
  })

  it('filters by action, exactly or by family', async () => {
    const cookie = await as('supervisor')
    const exact = await call('GET', '/api/audit?action=settings.update', { cookie })
    expect(exact.body.rows.length).toBeGreaterThanOrEqual(2)
    for (const r of exact.body.rows) expect(r.action).toBe('settings.update')
    const family = await call('GET', '/api/audit?action=settings', { cookie })
    expect(family.body.total).toBe(exact.body.total)
    expect((await call('GET', '/api/audit?action=settings.upd', { cookie })).body.total).toBe(0)
  })

  it('filters by time: from/to as instants, a bare "to" date including its whole UTC day', async () => {
    const cookie = await as('supervisor')
    const q = `action=settings.update&actor=${admin.id}&from=${since.toISOString()}&to=${until.toISOString()}`
    const inWindow = await call('GET', `/api/audit?${q}`, { cookie })
    expect(inWindow.body.total).toBe(2)
    expect(inWindow.body.rows.map((r: any) => r.reason)).toEqual(['second check of the audit filters', TRICKY_REASON])
    for (const r of inWindow.body.rows) expect(Date.parse(r.at)).toBeGreaterThanOrEqual(since.getTime())

    const today = await call('GET', `/api/audit?action=settings.update&actor=${admin.id}&from=${isoDay(since)}&to=${isoDay(until)}`, { cookie })
    expect(today.body.total).toBeGreaterThanOrEqual(2)
    const yesterday = isoDay(new Date(since.getTime() - 86_400_000))
    const before = await call('GET', `/api/audit?action=settings.update&actor=${admin.id}&to=${yesterday}`, { cookie })
    expect(before.body.rows.every((r: any) => Date.parse(r.at) < since.getTime())).toBe(true)
    const later = await call('GET', `/api/audit?from=${until.toISOString()}`, { cookie })
    expect(later.body.rows.every((r: any) => Date.parse(r.at) >= until.getTime())).toBe(true)
  })

  it('pages without overlap', async () => {
    const cookie = await as('admin')
    const all = await call('GET', '/api/audit?pageSize=200', { cookie })
    const p1 = await call('GET', '/api/audit?page=1&pageSize=2', { cookie })
    const p2 = await call('GET', '/api/audit?page=2&pageSize=2', { cookie })
    expect(p1.body).toMatchObject({ page: 1, pageSize: 2, total: all.body.total })
    expect(p2.body).toMatchObject({ page: 2, pageSize: 2 })
    expect([...p1.body.rows, ...p2.body.rows].map((r: any) => r.id)).toEqual(all.body.rows.slice(0, 4).map((r: any) => r.id))
    const beyond = await call('GET', `/api/audit?page=${all.body.total + 1}&pageSize=1`, { cookie })
    expect(beyond.body.rows).toEqual([])
  })

  it('refuses a bad date with 422 naming the field, and changes nothing', async () => {
    const cookie = await as('supervisor')
    const bad = await call('GET', '/api/audit?from=2026-02-30', { cookie })
    expect(bad.status).toBe(422)
    expect(bad.body.data.fields.map((f: any) => f.path)).toEqual(['from'])
    const word = await call('GET', '/api/audit?to=yesterday', { cookie })
    expect(word.status).toBe(422)
    expect(word.body.data.fields.map((f: any) => f.path)).toEqual(['to'])
    // A date-time needs its offset: without one it would mean different instants to different readers.
    expect((await call('GET', '/api/audit?from=2026-03-01T08:00:00', { cookie })).status).toBe(422)
    const reversed = await call('GET', '/api/audit?from=2026-03-02&to=2026-03-01', { cookie })
    expect(reversed.status).toBe(422)
    expect(reversed.body.data.fields.map((f: any) => f.path)).toEqual(['to'])
  })

  it('refuses a page size above 200 and a page below 1 with 422', async () => {
    const cookie = await as('supervisor')
    const big = await call('GET', '/api/audit?pageSize=201', { cookie })
    expect(big.status).toBe(422)
    expect(big.body.data.fields.map((f: any) => f.path)).toEqual(['pageSize'])
    const zero = await call('GET', '/api/audit?page=0', { cookie })
    expect(zero.status).toBe(422)
    expect(zero.body.data.fields.map((f: any) => f.path)).toEqual(['page'])
  })
})

describe('GET /api/audit/export.csv', () => {
  it('downloads a CSV with a header row, an attachment name with the date and the filters applied', async () => {
    const res = await fetch(`${baseURL()}/api/audit/export.csv?entity=lab-settings&action=settings.update`, { headers: { cookie: await as('supervisor') } })
    expect(res.status).toBe(200)
    expect(res.headers.get('content-type')).toMatch(/^text\/csv; charset=utf-8/)
    const today = new Date().toISOString().slice(0, 10).replace(/-/g, '')
    expect(res.headers.get('content-disposition')).toBe(`attachment; filename="emberline-audit-${today}.csv"`)
    const bytes = new Uint8Array(await res.arrayBuffer())
    // UTF-8 byte-order mark first, so spreadsheet programs read accented names right.
    expect([...bytes.slice(0, 3)]).toEqual([0xEF, 0xBB, 0xBF])
    const text = new TextDecoder('utf-8', { ignoreBOM: false }).decode(bytes)
    expect(text.endsWith('\r\n')).toBe(true)
    const [header, ...rows] = parseCsv(text)
    expect(header).toEqual(['time_utc', 'actor', 'actor_id', 'action', 'entity', 'entity_id', 'reason', 'old_values', 'new_values', 'request_id', 'audit_id'])
    expect(rows.length).toBe(Number(res.headers.get('x-total-count')))
    expect(rows.length).toBeGreaterThanOrEqual(2)
    for (const r of rows) {
      expect(r).toHaveLength(header!.length)
      expect(r[3]).toBe('settings.update')
      expect(r[4]).toBe('lab-settings')
    }
  })

  it('quotes per RFC 4180 and defuses a leading = so spreadsheets show it as text', async () => {
    const res = await call('GET', `/api/audit/export.csv?actor=${admin.id}&action=settings.update&from=${since.toISOString()}&to=${until.toISOString()}`, { cookie: await as('admin') })
    expect(res.status).toBe(200)
    const text = res.body as string
    // The raw field: prefixed with ', wrapped in quotes, inner quotes doubled.
    expect(text).toContain(`"'=HYPERLINK(""http://example.test"",""open""), checked by ""QA"""`)
    // (fetch's text() has already dropped the byte-order mark)
    const rows = parseCsv(text)
    const tricky = rows.find(r => r[6]?.includes('HYPERLINK'))!
    expect(tricky[6]).toBe(`'${TRICKY_REASON}`)
    expect(tricky[1]).toBe(admin.name)
    expect(JSON.parse(tricky[8]!).policy.waterMl).toEqual(expect.any(Number))
    expect(JSON.parse(tricky[7]!)).toHaveProperty('labName')
    expect(new Date(tricky[0]!).toISOString()).toBe(tricky[0])
  })

  it('refuses a bad date with 422 naming the field', async () => {
    const res = await call('GET', '/api/audit/export.csv?to=2026-13-01', { cookie: await as('admin') })
    expect(res.status).toBe(422)
    expect(res.body.data.fields.map((f: any) => f.path)).toEqual(['to'])
  })
})

describe('who may read the audit trail', () => {
  const routes = ['/api/audit', '/api/audit/export.csv', '/api/audit/facets']
  for (const path of routes) {
    for (const role of ['analyst', 'technician'] as const) {
      it(`GET ${path} → 403 for the ${role}`, async () => {
        const res = await call('GET', path, { cookie: await as(role) })
        expect(res.status).toBe(403)
      })
    }
    it(`GET ${path} → 200 for the supervisor and the admin`, async () => {
      expect((await call('GET', path, { cookie: await as('supervisor') })).status).toBe(200)
      expect((await call('GET', path, { cookie: await as('admin') })).status).toBe(200)
    })
  }

  it('offers the entities and actions present for the filter bar', async () => {
    const res = await call('GET', '/api/audit/facets', { cookie: await as('supervisor') })
    expect(res.body.entities).toContain('lab-settings')
    expect(res.body.actions).toContain('settings.update')
  })

  it('has no route that changes the trail, for anyone', async () => {
    const auditRoutes = apiRoutes().filter(r => r.key.includes(' /api/audit'))
    expect(auditRoutes.length).toBeGreaterThanOrEqual(3)
    expect(auditRoutes.every(r => r.method === 'GET')).toBe(true)
    const admin = await as('admin')
    for (const method of ['POST', 'PUT', 'PATCH', 'DELETE']) {
      const res = await call(method, '/api/audit', { cookie: admin, body: { reason: 'try' } })
      expect([404, 405]).toContain(res.status)
    }
  })
})
