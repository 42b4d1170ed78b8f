// Adds the demo lab's vessel care history to NUXT_DATABASE_URL: a routine seal service of KR-1 and KR-3
// on their last service dates, the last requalification of KR-1 with its certificate, and the lock-out record of
// KR-5. Run after scripts/seed.ts. Idempotent: each record carries a seed key and is added once.
// Files go to the uploads store the server reads (EMBERLINE_UPLOAD_DIR, default .data/uploads, from the folder it runs in).
import { randomUUID } from 'node:crypto'
import { deflateSync } from 'node:zlib'
import { and, eq, like, sql } from 'drizzle-orm'
import { drizzle } from 'drizzle-orm/node-postgres'
import pg from 'pg'
import { createStorage } from 'unstorage'
import fsDriver from 'unstorage/drivers/fs'
import * as schema from '../server/database/schema'
import { DEFAULT_POLICY } from '../shared/domain/policy'
import type { ServiceKind } from '../shared/schemas/services'

const url = process.env.NUXT_DATABASE_URL
if (!url) throw new Error('NUXT_DATABASE_URL is not set')
const pool = new pg.Pool({ connectionString: url, max: 2 })
const db = drizzle(pool, { schema })
const storage = createStorage({ driver: fsDriver({ base: process.env.EMBERLINE_UPLOAD_DIR || './.data/uploads' }) })
const HOUR = 3_600_000

// CRC-32 as PNG needs it (ISO/IEC 15948 Annex D).
const CRC_TABLE = Array.from({ length: 256 }, (_, n) => {
  let c = n
  for (let k = 0; k < 8; k++) c = c & 1 ? 0xEDB88320 ^ (c >>> 1) : c >>> 1
  return c >>> 0
})
function crc32(buf: Buffer) {
  let c = 0xFFFFFFFF
  for (const b of buf) c = CRC_TABLE[(c ^ b) & 0xFF]! ^ (c >>> 8)
  return (c ^ 0xFFFFFFFF) >>> 0
}
function chunk(type: string, data: Buffer) {
  const len = Buffer.alloc(4)
  len.writeUInt32BE(data.length)
  const body = Buffer.concat([Buffer.from(type, 'latin1'), data])
  const crc = Buffer.alloc(4)
  crc.writeUInt32BE(crc32(body))
  return Buffer.concat([len, body, crc])
}

/** A small demo photo: a grey sealing face with a darker ring where the O-ring seats (invented picture). */
function demoPhoto(size = 96): Buffer {
  const rows: Buffer[] = []
  for (let y = 0; y < size; y++) {
    const row = Buffer.alloc(1 + size * 3)
    for (let x = 0; x < size; x++) {
      const r = Math.hypot(x - size / 2, y - size / 2)
      const ring = Math.abs(r - size * 0.32) < size * 0.04
      const v = r > size * 0.47 ? 236 : ring ? 70 : 150 + Math.round(40 * Math.sin(x / 7 + y / 11))
      row.set([v, v, ring ? v : v + 6], 1 + x * 3)
    }
    rows.push(row)
  }
  const ihdr = Buffer.alloc(13)
  ihdr.writeUInt32BE(size, 0)
  ihdr.writeUInt32BE(size, 4)
  ihdr.set([8, 2, 0, 0, 0], 8)
  return Buffer.concat([Buffer.from([0x89, 0x50, 0x4E, 0x47, 0x0D, 0x0A, 0x1A, 0x0A]), chunk('IHDR', ihdr), chunk('IDAT', deflateSync(Buffer.concat(rows))), chunk('IEND', Buffer.alloc(0))])
}

/** A one-page demo certificate as a plain PDF (ISO 32000-1 file structure, Helvetica text). */
function demoCertificate(lines: string[]): Buffer {
  const text = lines.map((l, i) => `BT /F1 ${i === 0 ? 16 : 11} Tf 56 ${760 - i * 22} Td (${l.replace(/[()\\]/g, '\\$&')}) Tj ET`).join('\n')
  const objects = [
    '<< /Type /Catalog /Pages 2 0 R >>',
    '<< /Type /Pages /Kids [3 0 R] /Count 1 >>',
    '<< /Type /Page /Parent 2 0 R /MediaBox [0 0 595 842] /Resources << /Font << /F1 5 0 R >> >> /Contents 4 0 R >>',
    `<< /Length ${Buffer.byteLength(text, 'latin1')} >>\nstream\n${text}\nendstream`,
    '<< /Type /Font /Subtype /Type1 /BaseFont /Helvetica >>',
  ]
  let out = '%PDF-1.4\n'
  const offsets: number[] = []
  objects.forEach((o, i) => {
    offsets.push(Buffer.byteLength(out, 'latin1'))
    out += `${i + 1} 0 obj\n${o}\nendobj\n`
  })
  const xref = Buffer.byteLength(out, 'latin1')
  out += `xref\n0 ${objects.length + 1}\n0000000000 65535 f \n${offsets.map(o => `${String(o).padStart(10, '0')} 00000 n \n`).join('')}`
  out += `trailer\n<< /Size ${objects.length + 1} /Root 1 0 R >>\nstartxref\n${xref}\n%%EOF\n`
  return Buffer.from(out, 'latin1')
}

type VesselRow = typeof schema.vessels.$inferSelect
interface SeedFile { fileName: string, contentType: string, ext: string, data: Buffer }

const routineRecord = (lots: string, torque: number, ohm: number, notes: string) => ({
  seals: [
    { position: 'head', name: 'Head O-ring', renewed: true, lot: `HO-${lots}` },
    { position: 'valve', name: 'Inlet valve seal', renewed: true, lot: `VS-${lots}` },
    { position: 'valve', name: 'Outlet valve seal', renewed: true, lot: `VS-${lots}` },
    { position: 'electrode', name: 'Electrode seal', renewed: true, lot: `ES-${lots}` },
  ],
  valveSeatRenewed: true,
  electrodeInsulators: 'inspected',
  packingNutTorqueNm: torque,
  electrodeResistanceOhm: ohm,
  electrodeResistanceLimitOhm: DEFAULT_POLICY.electrodeResistanceMaxOhm,
  leakTest: { passed: true, pressureMPa: 3.0, where: '' },
  sealingSurfaces: 'good',
  threads: 'good',
  partsUsed: [{ part: 'Seal kit, standard vessel', lot: `SK-${lots}`, quantity: 1 }, { part: 'Valve seat', lot: `VT-${lots}`, quantity: 1 }],
  notes,
  effect: { condition: 'awaiting-verification', lockCause: null, checksPassed: true, message: 'Routine service recorded: the service counter is reset. Awaiting a passing check run: only standardisation or check runs until then.' },
})

const [tech] = await db.select().from(schema.users).where(eq(schema.users.email, 'technician@emberline.test'))
if (!tech) throw new Error('run scripts/seed.ts first: the demo technician is missing')
const vessel = async (prefix: string) => (await db.select().from(schema.vessels).where(like(schema.vessels.name, `${prefix} %`)))[0]

async function addRecord(v: VesselRow | undefined, seedKey: string, kind: ServiceKind, performedAt: Date | null, record: Record<string, unknown>, opts: { createdAt?: Date, files?: SeedFile[] } = {}) {
  if (!v || !performedAt) return console.log(`skipped ${seedKey}: vessel or date missing`)
  const createdAt = opts.createdAt ?? new Date(performedAt.getTime() + 2 * HOUR)
  const added = await db.transaction(async (tx) => {
    const [seen] = await tx.select({ id: schema.services.id }).from(schema.services)
      .where(and(eq(schema.services.vesselId, v.id), sql`${schema.services.record}->>'seedKey' = ${seedKey}`))
    if (seen) return false
    const [row] = await tx.insert(schema.services).values({
      vesselId: v.id, kind, performedAt, signedBy: tech!.id, signerName: tech!.name, createdAt,
      record: { ...record, seedKey, signature: { signerName: tech!.name, signedAt: createdAt.toISOString(), meaning: 'did or witnessed this work and records it as true' } },
    }).returning()
    const files = []
    for (const f of opts.files ?? []) {
      const storageKey = `vessel:${v.id}:${randomUUID()}.${f.ext}`
      await storage.setItemRaw(storageKey, f.data)
      const [a] = await tx.insert(schema.attachments).values({ serviceId: row!.id, storageKey, fileName: f.fileName, contentType: f.contentType, sizeBytes: f.data.length, uploadedBy: tech!.id, createdAt }).returning()
      files.push({ id: a!.id, fileName: a!.fileName })
    }
    await tx.insert(schema.auditLog).values({
      actorId: tech!.id, actorName: tech!.name, action: `service.${kind}`, entity: 'vessel', entityId: v.id,
      newValues: { service: row, attachments: files }, reason: 'demo care history loaded',
    })
    return true
  })
  console.log(added ? `added ${seedKey}` : `kept ${seedKey}`)
}

const kr1 = await vessel('KR-1')
const kr3 = await vessel('KR-3')
const kr5 = await vessel('KR-5')

await addRecord(kr1, 'demo:kr1:requalification', 'requalification', kr1?.lastRequalifiedAt ?? null, {
  body: 'Northgate Pressure Testing Ltd (demo)', certificateNumber: 'NPT-DEMO-4471', testPressureMPa: 20.7,
  testedFrom: kr1?.lastRequalifiedAt ? new Date(kr1.lastRequalifiedAt.getTime() - 3 * 24 * HOUR).toISOString().slice(0, 10) : '',
  testedTo: kr1?.lastRequalifiedAt?.toISOString().slice(0, 10) ?? '',
  passed: true, findings: 'Hydrostatic test held; threads and sealing faces within the dimensional limits.', notes: '',
  effect: { condition: 'awaiting-verification', lockCause: null, message: 'Requalification recorded: both counters are reset. Awaiting a passing check run: only standardisation or check runs until then.' },
}, {
  files: [{
    fileName: 'NPT-DEMO-4471 certificate.pdf', contentType: 'application/pdf', ext: 'pdf',
    data: demoCertificate(['Requalification certificate (demo)', `Vessel ${kr1?.name ?? ''}, serial ${kr1?.serialNumber ?? ''}`, 'Hydrostatic test at 20.7 MPa: held, no permanent deformation.', 'Dimensional inspection: within limits.', 'Certificate NPT-DEMO-4471 - invented for the Emberline demo lab.']),
  }],
})
await addRecord(kr1, 'demo:kr1:routine', 'routine', kr1?.lastServicedAt ?? null, routineRecord('2611', 12, 1.6, 'Check run passed the next morning.'), {
  files: [{ fileName: 'KR-1 head sealing face.png', contentType: 'image/png', ext: 'png', data: demoPhoto() }],
})
await addRecord(kr3, 'demo:kr3:routine', 'routine', kr3?.lastServicedAt ?? null, routineRecord('2644', 12, 2.1, 'High-strength vessel: waits for its check run before any sample.'), {
  files: [{ fileName: 'KR-3 valve seat.png', contentType: 'image/png', ext: 'png', data: demoPhoto(80) }],
})
// The lock-out record starts the lock-out: same instant, so the return-to-service rule finds its cause.
await addRecord(kr5, 'demo:kr5:lock-out', 'lock-out', kr5?.conditionSince ?? null, {
  reason: kr5?.conditionReason ?? 'Overpressure reported on firing.',
  notes: 'Vessel tagged and stored apart; requalification to be arranged.',
  effect: { condition: 'locked-out', lockCause: 'manual', message: `Recorded. The vessel is locked out: ${kr5?.conditionReason ?? ''}` },
}, { createdAt: kr5?.conditionSince ?? undefined })

await pool.end()
console.log('vessel care history ready')
