import { existsSync } from 'node:fs'
import { join } from 'node:path'
import { fileURLToPath } from 'node:url'
import { describe, expect, it } from 'vitest'
import { as, baseURL, call, DEMO_PASSWORD, unique } from '../support/api'
import { auditRows, testDb } from '../support/db'

// File signatures (magic numbers): PNG 89 50 4E 47 0D 0A 1A 0A (ISO/IEC 15948 §5.2); JPEG FF D8 FF (ISO/IEC 10918-1
// Annex B); WebP "RIFF" size "WEBP" (RFC 9649 §2); PDF "%PDF-" (ISO 32000-1 §7.5.2); ELF 7F 45 4C 46 (System V ABI);
// Windows executables "MZ" (Microsoft PE format).
const PNG = Buffer.concat([Buffer.from([0x89, 0x50, 0x4E, 0x47, 0x0D, 0x0A, 0x1A, 0x0A]), Buffer.from('IHDR demo image body')])
const JPEG = Buffer.concat([Buffer.from([0xFF, 0xD8, 0xFF, 0xE0]), Buffer.from('JFIF demo body')])
const WEBP = Buffer.concat([Buffer.from('RIFF'), Buffer.from([0x20, 0, 0, 0]), Buffer.from('WEBPVP8 demo body')])
const PDF = Buffer.from('%PDF-1.4\n1 0 obj << /Type /Catalog >> endobj\n%%EOF\n')
const ELF = Buffer.concat([Buffer.from([0x7F, 0x45, 0x4C, 0x46, 2, 1, 1, 0]), Buffer.alloc(64)])
const MZ = Buffer.concat([Buffer.from('MZ'), Buffer.alloc(64)])
const root = fileURLToPath(new URL('../..', import.meta.url))
const uploadDir = process.env.EMBERLINE_UPLOAD_DIR || join(root, '.data/uploads')

async function vessel() {
  const res = await call('POST', '/api/vessels', {
    cookie: await as('admin'),
    body: { name: unique('Upl'), serialNumber: unique('SN'), class: 'standard', ratedEnergyJ: 33000, maxChargeMassG: 1.5, maxFillPressureMPa: 4.05, volumeMl: 300 },
  })
  return res.body
}

async function upload(vesselId: string, files: { name: string, data: Buffer, type?: string }[], cookie?: string | null) {
  const form = new FormData()
  for (const f of files) form.append('files', new Blob([new Uint8Array(f.data)], { type: f.type ?? 'application/octet-stream' }), f.name)
  const headers: Record<string, string> = {}
  if (cookie !== null) headers.cookie = cookie ?? await as('technician')
  const res = await fetch(`${baseURL()}/api/vessels/${vesselId}/attachments`, { method: 'POST', body: form, headers })
  return { status: res.status, body: await res.json().catch(() => null) as any }
}

async function inspection(vesselId: string, attachmentIds: string[]) {
  return call('POST', `/api/vessels/${vesselId}/services`, {
    cookie: await as('technician'),
    body: { kind: 'inspection', performedAt: new Date().toISOString(), password: DEMO_PASSWORD, findings: 'Sealing face photographed', damageOrCorrosionSeen: false, attachmentIds },
  })
}

const attachmentCount = async () => Number((await testDb().query('select count(*)::int as n from attachments')).rows[0].n)

describe('POST /api/vessels/:id/attachments', () => {
  it('accepts JPEG, PNG and WebP photos and PDF certificates, judged by their content, each under a random key', async () => {
    const v = await vessel()
    const res = await upload(v.id, [
      { name: 'face.png', data: PNG, type: 'image/png' },
      { name: 'thread.jpeg', data: JPEG },
      { name: 'seat.webp', data: WEBP },
      // The content decides: a PDF sent as image/png with a .png name is stored as the PDF it is, named .pdf.
      { name: 'certificate.png', data: PDF, type: 'image/png' },
    ])
    expect(res.status).toBe(201)
    expect(res.body.map((a: any) => [a.fileName, a.contentType, a.sizeBytes])).toEqual([
      ['face.png', 'image/png', PNG.length],
      ['thread.jpeg', 'image/jpeg', JPEG.length],
      ['seat.webp', 'image/webp', WEBP.length],
      ['certificate.pdf', 'application/pdf', PDF.length],
    ])
    const { rows } = await testDb().query('select storage_key from attachments where id = any($1)', [res.body.map((a: any) => a.id)])
    for (const r of rows) {
      expect(r.storage_key).toMatch(new RegExp(`^vessel:${v.id}:[0-9a-f-]{36}\\.(png|jpg|webp|pdf)$`))
      expect(existsSync(join(uploadDir, r.storage_key.replace(/:/g, '/')))).toBe(true)
    }
    expect(await auditRows({ action: 'attachment.upload', entityId: v.id })).toHaveLength(1)
  })

  it('refuses a renamed executable (an ELF or MZ file called photo.jpg) with 422, storing nothing', async () => {
    const v = await vessel()
    const before = await attachmentCount()
    for (const [name, data] of [['photo.jpg', ELF], ['certificate.pdf', MZ]] as const) {
      const res = await upload(v.id, [{ name, data, type: 'image/jpeg' }])
      expect(res.status).toBe(422)
      expect(res.body.data.fields[0]).toMatchObject({ path: 'files.0' })
      expect(res.body.data.fields[0].message).toMatch(/judged from the file's content/)
    }
    // One bad file refuses the whole request: the good one beside it is not kept either.
    const mixed = await upload(v.id, [{ name: 'ok.png', data: PNG }, { name: 'run.png', data: ELF }])
    expect(mixed.status).toBe(422)
    expect(mixed.body.data.fields[0].path).toBe('files.1')
    expect(await attachmentCount()).toBe(before)
    expect(await auditRows({ action: 'attachment.upload', entityId: v.id })).toHaveLength(0)
  })

  it('refuses a file above the policy\'s upload limit with 413', async () => {
    const v = await vessel()
    const admin = await as('admin')
    const original = (await call('GET', '/api/settings', { cookie: admin })).body.policy.uploadMaxBytes
    expect(original).toBe(10 * 1024 * 1024)
    const set = await call('PATCH', '/api/settings', { cookie: admin, body: { policy: { uploadMaxBytes: 1024 }, reason: 'upload limit test (tests/api/uploads.test.ts)' } })
    expect(set.status).toBe(200)
    try {
      const before = await attachmentCount()
      const big = Buffer.concat([PNG, Buffer.alloc(2048)])
      const res = await upload(v.id, [{ name: 'big.png', data: big }])
      expect(res.status).toBe(413)
      expect(res.body.data.fields[0].path).toBe('files.0')
      expect(await attachmentCount()).toBe(before)
      const small = await upload(v.id, [{ name: 'small.png', data: PNG }])
      expect(small.status).toBe(201)
    }
    finally {
      const back = await call('PATCH', '/api/settings', { cookie: admin, body: { policy: { uploadMaxBytes: original }, reason: 'restore after the upload limit test' } })
      expect(back.status).toBe(200)
    }
  })

  it('keeps only a safe file name: no path parts, safe characters, the detected type\'s extension', async () => {
    const v = await vessel()
    const res = await upload(v.id, [
      { name: '../../etc/passwd.png', data: PNG },
      { name: '..\\..\\Windows\\sys<t>em|x.pdf', data: PDF },
      { name: '.hidden.exe', data: JPEG },
    ])
    expect(res.status).toBe(201)
    expect(res.body.map((a: any) => a.fileName)).toEqual(['passwd.png', 'sys_t_em_x.pdf', 'hidden.jpg'])
    for (const a of res.body) expect(a.fileName).not.toMatch(/[/\\]|\.\./)
    expect(existsSync(join(uploadDir, 'etc/passwd.png'))).toBe(false)
  })

  it('is the technician\'s: 401 without a session, 403 for other roles, 404 for an unknown vessel, 415 without a multipart body, 422 without a file', async () => {
    const v = await vessel()
    expect((await upload(v.id, [{ name: 'a.png', data: PNG }], null)).status).toBe(401)
    for (const role of ['analyst', 'supervisor', 'admin'] as const) expect((await upload(v.id, [{ name: 'a.png', data: PNG }], await as(role))).status).toBe(403)
    expect((await upload('00000000-0000-4000-8000-000000000009', [{ name: 'a.png', data: PNG }])).status).toBe(404)
    expect((await call('POST', `/api/vessels/${v.id}/attachments`, { cookie: await as('technician'), body: { file: 'x' } })).status).toBe(415)
    const form = new FormData()
    form.append('note', 'no file here')
    const empty = await fetch(`${baseURL()}/api/vessels/${v.id}/attachments`, { method: 'POST', body: form, headers: { cookie: await as('technician') } })
    expect(empty.status).toBe(422)
    expect((await empty.json()).data.fields[0].path).toBe('files')
  })
})

describe('attachments on servicing records and GET /api/attachments/:id', () => {
  it('attaches uploads to a record and serves them to signed-in users only: images inline, PDFs as attachments, never sniffed', async () => {
    const v = await vessel()
    const up = (await upload(v.id, [{ name: 'face.png', data: PNG }, { name: 'cert.pdf', data: PDF }])).body
    const [png, pdf] = up
    // Before a record names it, an upload is its uploader's alone.
    expect((await call('GET', `/api/attachments/${png.id}`, { cookie: await as('analyst') })).status).toBe(404)
    expect((await fetch(`${baseURL()}${png.url}`, { headers: { cookie: await as('technician') } })).status).toBe(200)

    const rec = await inspection(v.id, up.map((a: any) => a.id))
    expect(rec.status).toBe(201)
    expect(rec.body.service.attachments.map((a: any) => a.id)).toEqual([png.id, pdf.id])

    const unauth = await fetch(`${baseURL()}${png.url}`)
    expect(unauth.status).toBe(401)
    const img = await fetch(`${baseURL()}${png.url}`, { headers: { cookie: await as('analyst') } })
    expect(img.status).toBe(200)
    expect(img.headers.get('content-type')).toBe('image/png')
    expect(img.headers.get('x-content-type-options')).toBe('nosniff')
    expect(img.headers.get('content-disposition')).toBe('inline; filename="face.png"')
    expect(Buffer.from(await img.arrayBuffer()).equals(PNG)).toBe(true)
    const doc = await fetch(`${baseURL()}${pdf.url}`, { headers: { cookie: await as('supervisor') } })
    expect(doc.status).toBe(200)
    expect(doc.headers.get('content-type')).toBe('application/pdf')
    expect(doc.headers.get('content-disposition')).toBe('attachment; filename="cert.pdf"')
    expect(doc.headers.get('x-content-type-options')).toBe('nosniff')

    const history = (await call('GET', `/api/vessels/${v.id}/services`, { cookie: await as('analyst') })).body
    expect(history[0].attachments.map((a: any) => a.fileName)).toEqual(['face.png', 'cert.pdf'])
    expect((await call('GET', '/api/attachments/00000000-0000-4000-8000-000000000009', { cookie: await as('analyst') })).status).toBe(404)
    expect((await call('GET', '/api/attachments/not-an-id', { cookie: await as('analyst') })).status).toBe(422)
  })

  it('refuses uploads of another vessel or already part of a record (422), recording nothing', async () => {
    const v = await vessel()
    const w = await vessel()
    const [mine] = (await upload(v.id, [{ name: 'a.png', data: PNG }])).body
    const other = await inspection(w.id, [mine.id])
    expect(other.status).toBe(422)
    expect(other.body.data.fields[0].path).toBe('attachmentIds')
    expect((await inspection(v.id, [mine.id])).status).toBe(201)
    const again = await inspection(v.id, [mine.id])
    expect(again.status).toBe(422)
    const { rows } = await testDb().query('select count(*)::int as n from services where vessel_id = $1', [w.id])
    expect(rows[0].n).toBe(0)
  })
})
