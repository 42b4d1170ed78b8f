// Clients and received samples: loading, the view the API answers with, and drawing a new lab code.
import { eq, sql } from 'drizzle-orm'
import { formatLabCode, labCodePrefix } from '#shared/schemas/samples'
import type { SampleStatus } from '#shared/schemas/samples'
import type { clients, samples } from '../database/schema'

export type ClientRow = typeof clients.$inferSelect
export type SampleRow = typeof samples.$inferSelect

export function clientView(c: ClientRow) {
  return { id: c.id, name: c.name, contactName: c.contactName, contactEmail: c.contactEmail, address: c.address, createdAt: c.createdAt }
}

export function sampleView(s: SampleRow, extra: { clientName?: string | null, materialName?: string | null, materialCategory?: string | null } = {}, now = new Date()) {
  return {
    id: s.id,
    labCode: s.labCode,
    clientId: s.clientId,
    clientName: extra.clientName ?? null,
    clientReference: s.clientReference,
    description: s.description,
    materialId: s.materialId,
    materialName: extra.materialName ?? null,
    materialCategory: extra.materialCategory ?? null,
    receivedAt: s.receivedAt,
    ageHours: Math.max(0, Math.floor((now.getTime() - s.receivedAt.getTime()) / 3_600_000)),
    condition: s.condition,
    receivedMassG: s.receivedMassG,
    note: s.note,
    status: s.status as SampleStatus,
    rejectionReason: s.rejectionReason,
    createdAt: s.createdAt,
    updatedAt: s.updatedAt,
  }
}
export type SampleView = ReturnType<typeof sampleView>

/** The next lab code: a number from the database sequence (never handed out twice, even if the receipt then fails). */
export async function nextLabCode(tx: Tx, labName: string, receivedAt: Date): Promise<string> {
  const { rows } = await tx.execute<{ n: string }>(sql`select nextval('sample_lab_code_seq') as n`)
  return formatLabCode(labCodePrefix(labName), receivedAt.getUTCFullYear(), Number(rows[0]!.n))
}

export async function findSampleOr404(db: Db | Tx, id: string, lock = false): Promise<SampleRow> {
  const q = db.select().from(schema.samples).where(eq(schema.samples.id, id))
  const [row] = lock ? await q.for('update') : await q
  if (!row) throw createError({ statusCode: 404, message: 'No such sample.' })
  return row
}

export async function findClientOr404(db: Db | Tx, id: string): Promise<ClientRow> {
  const [row] = await db.select().from(schema.clients).where(eq(schema.clients.id, id))
  if (!row) throw createError({ statusCode: 404, message: 'No such client.' })
  return row
}
