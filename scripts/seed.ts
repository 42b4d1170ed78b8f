// Loads the demo lab into NUXT_DATABASE_URL. Idempotent: a second run adds nothing.
import { Hash } from '@adonisjs/hash'
import { Scrypt } from '@adonisjs/hash/drivers/scrypt'
import { eq } from 'drizzle-orm'
import { drizzle } from 'drizzle-orm/node-postgres'
import pg from 'pg'
import * as schema from '../server/database/schema'
import { scryptOptions } from '../server/utils/password-cost'
import { DEFAULT_POLICY } from '../shared/domain/policy'
import { DEMO_LAB_NAME, DEMO_MATERIALS, DEMO_PASSWORD, DEMO_USERS, demoVessels } from '../data/demo-lab'
import { REFERENCE_MATERIALS } from '../data/reference-materials'

const url = process.env.NUXT_DATABASE_URL
if (!url) throw new Error('NUXT_DATABASE_URL is not set')
const pool = new pg.Pool({ connectionString: url, max: 2 })
const db = drizzle(pool, { schema })
// The same scrypt settings as the server (EMBERLINE_PASSWORD_HASH_COST; OWASP's N = 2^17 unless it says "test").
const hasher = new Hash(new Scrypt(scryptOptions(process.env.EMBERLINE_PASSWORD_HASH_COST)))

await db.transaction(async (tx) => {
  const settings = await tx.insert(schema.labSettings).values({ id: 1, labName: DEMO_LAB_NAME, policy: DEFAULT_POLICY })
    .onConflictDoNothing().returning()
  if (settings.length) {
    await tx.insert(schema.auditLog).values({ action: 'seed.lab-settings', entity: 'lab-settings', entityId: '1', newValues: settings[0]!, reason: 'demo lab loaded' })
  }
  const existing = new Set((await tx.select({ email: schema.users.email }).from(schema.users)).map(r => r.email))
  for (const u of DEMO_USERS.filter(d => !existing.has(d.email))) {
    const rows = await tx.insert(schema.users).values({ ...u, passwordHash: await hasher.make(DEMO_PASSWORD) })
      .onConflictDoNothing({ target: schema.users.email }).returning({ id: schema.users.id })
    if (rows.length) {
      await tx.insert(schema.auditLog).values({ action: 'user.create', entity: 'user', entityId: rows[0]!.id, newValues: u, reason: 'demo lab loaded' })
    }
  }
  const P = DEFAULT_POLICY
  for (const v of demoVessels()) {
    const rows = await tx.insert(schema.vessels).values({
      ...v,
      proofChargeMassG: P.proofChargeMassG,
      proofChargeHeatingValueJPerG: P.proofChargeHeatingValueJPerG,
      proofChargeFillPressureMPa: P.proofChargeFillPressureMPa,
      serviceIntervalFirings: P.serviceIntervalFirings,
      serviceIntervalDays: P.serviceIntervalDays,
      requalificationIntervalFirings: P.requalificationIntervalFirings,
      firingsTotalAtRegistration: v.firingsTotal,
      conditionSince: v.condition === 'normal' ? null : new Date(),
      registeredAt: new Date(Date.now() - 400 * 86_400_000),
    }).onConflictDoNothing({ target: schema.vessels.name }).returning()
    if (rows.length) {
      await tx.insert(schema.auditLog).values({ action: 'vessel.register', entity: 'vessel', entityId: rows[0]!.id, newValues: rows[0]!, reason: 'demo lab loaded' })
    }
  }
  const knownMaterials = new Set((await tx.select({ name: schema.materials.name }).from(schema.materials)).map(r => r.name))
  // The demo supervisor recorded the classification of the lab's own materials (shipped ones are reference records).
  const [supervisor] = await tx.select({ id: schema.users.id }).from(schema.users).where(eq(schema.users.email, 'supervisor@emberline.test'))
  const recorded = supervisor ? { identityRecordedBy: supervisor.id, identityRecordedAt: new Date() } : {}
  for (const m of [...REFERENCE_MATERIALS, ...DEMO_MATERIALS.map(d => ({ ...d, ...recorded }))].filter(m => !knownMaterials.has(m.name))) {
    const [row] = await tx.insert(schema.materials).values(m).returning()
    await tx.insert(schema.auditLog).values({ action: 'material.create', entity: 'material', entityId: row!.id, newValues: row!, reason: 'demo lab loaded' })
  }
})
await pool.end()
console.log('demo lab ready')
