import { SIGNATURE_MEANINGS } from '#shared/states'
import { createHash } from 'node:crypto'
import { and, eq, isNull } from 'drizzle-orm'
import { aidSeries } from '#shared/domain/results'
import { acceptAidValueSchema } from '#shared/schemas/aid-values'

// A supervisor accepts the lab's own series of determinations of an aid (signed): its mean replaces the typical value.
export default defineEventHandler(async (event) => {
  const user = await requireRole(event)
  const input = await parseBody(event, acceptAidValueSchema)
  const db = useDb()
  const series = aidSeries(input.determinationsJPerG)
  if (!series.accepted) invalidInput([{ path: 'determinationsJPerG', message: series.reason ?? 'the series cannot be accepted' }])
  if (input.materialId) {
    const [m] = await db.select({ id: schema.materials.id }).from(schema.materials).where(eq(schema.materials.id, input.materialId))
    if (!m) invalidInput([{ path: 'materialId', message: 'no such material' }])
  }
  await verifySigner(event, user.id, input.password, 'aid-value', input.materialId ?? '00000000-0000-0000-0000-000000000000')
  const accepted = await db.transaction(async (tx) => {
    const same = input.materialId ? eq(schema.aidValues.materialId, input.materialId) : and(eq(schema.aidValues.kind, input.kind), isNull(schema.aidValues.materialId))
    const replaced = await tx.update(schema.aidValues).set({ active: false }).where(and(same, eq(schema.aidValues.active, true))).returning({ id: schema.aidValues.id })
    const [row] = await tx.insert(schema.aidValues).values({
      kind: input.kind, materialId: input.materialId ?? null, lot: input.lot, determinationsJPerG: input.determinationsJPerG, runs: series.n,
      meanJPerG: series.meanJPerG, standardDeviationJPerG: series.standardDeviationJPerG, standardUncertaintyJPerG: series.standardUncertaintyJPerG,
      note: input.note, acceptedBy: user.id,
    }).returning()
    const boundHash = createHash('sha256').update(JSON.stringify({ id: row!.id, kind: input.kind, materialId: input.materialId ?? null, values: input.determinationsJPerG })).digest('hex')
    const [sig] = await tx.insert(schema.signatures).values({
      entity: 'aid-value', entityId: row!.id, signerId: user.id, signerName: user.name, meaning: SIGNATURE_MEANINGS.aidValue, reason: input.reason, boundHash,
    }).returning()
    await tx.update(schema.aidValues).set({ signatureId: sig!.id }).where(eq(schema.aidValues.id, row!.id))
    await audit(tx, event, {
      action: 'aid-value.accept', entity: 'aid-value', entityId: row!.id,
      oldValues: replaced.length ? { replacedIds: replaced.map(r => r.id) } : undefined,
      newValues: { kind: input.kind, materialId: input.materialId ?? null, lot: input.lot, determinationsJPerG: input.determinationsJPerG, meanJPerG: series.meanJPerG, standardUncertaintyJPerG: series.standardUncertaintyJPerG, signatureId: sig!.id },
      reason: input.reason,
    })
    return aidValueView({ ...row!, signatureId: sig!.id }, { acceptedByName: user.name })
  })
  const session = await getUserSession(event)
  await replaceUserSession(event, { user: session.user, epoch: session.epoch, loggedInAt: session.loggedInAt, lastSeenAt: Date.now() })
  setResponseStatus(event, 201)
  return { aidValue: accepted, statistics: series }
})
