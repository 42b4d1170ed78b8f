// The record's own name for each audit row: a sample code, a vessel, plan, material or user name, a report number.
import { inArray } from 'drizzle-orm'

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i

type Lookup = (db: Db | Tx, ids: string[]) => Promise<{ id: string, label: string }[]>

// One query per kind of record on the page, by primary key.
const LOOKUPS: Record<string, Lookup> = {
  'run': (db, ids) => db.select({ id: schema.runs.id, label: schema.runs.sampleCode }).from(schema.runs).where(inArray(schema.runs.id, ids)),
  'vessel': (db, ids) => db.select({ id: schema.vessels.id, label: schema.vessels.name }).from(schema.vessels).where(inArray(schema.vessels.id, ids)),
  'plan': (db, ids) => db.select({ id: schema.plans.id, label: schema.plans.name }).from(schema.plans).where(inArray(schema.plans.id, ids)),
  'user': (db, ids) => db.select({ id: schema.users.id, label: schema.users.name }).from(schema.users).where(inArray(schema.users.id, ids)),
  'material': (db, ids) => db.select({ id: schema.materials.id, label: schema.materials.name }).from(schema.materials).where(inArray(schema.materials.id, ids)),
  'result': (db, ids) => db.select({ id: schema.results.id, label: schema.results.sampleCode }).from(schema.results).where(inArray(schema.results.id, ids)),
  'attachment': (db, ids) => db.select({ id: schema.attachments.id, label: schema.attachments.fileName }).from(schema.attachments).where(inArray(schema.attachments.id, ids)),
  'energy-equivalent': async (db, ids) => {
    const rows = await db.select({ id: schema.energyEquivalents.id, vesselId: schema.energyEquivalents.vesselId }).from(schema.energyEquivalents).where(inArray(schema.energyEquivalents.id, ids))
    const names = rows.length ? await LOOKUPS.vessel!(db, [...new Set(rows.map(r => r.vesselId))]) : []
    return rows.map(r => ({ id: r.id, label: `ε of ${names.find(n => n.id === r.vesselId)?.label ?? 'a vessel'}` }))
  },
  'report': async (db, ids) => {
    const rows = await db.select({ id: schema.reports.id, n: schema.reports.reportNumber, code: schema.reports.sampleCode }).from(schema.reports).where(inArray(schema.reports.id, ids))
    return rows.map(r => ({ id: r.id, label: `Report ${r.n} · ${r.code}` }))
  },
}

/** `${entity}:${entityId}` → the record's own name, for the rows given; records without a name are left out. */
export async function auditRecordNames(db: Db | Tx, rows: { entity: string, entityId: string | null }[]): Promise<Record<string, string>> {
  const byEntity = new Map<string, Set<string>>()
  for (const r of rows) {
    if (!r.entityId || !UUID.test(r.entityId) || !LOOKUPS[r.entity]) continue
    if (!byEntity.has(r.entity)) byEntity.set(r.entity, new Set())
    byEntity.get(r.entity)!.add(r.entityId.toLowerCase())
  }
  const out: Record<string, string> = {}
  await Promise.all([...byEntity].map(async ([entity, ids]) => {
    for (const { id, label } of await LOOKUPS[entity]!(db, [...ids])) out[`${entity}:${id}`] = label
  }))
  return out
}
