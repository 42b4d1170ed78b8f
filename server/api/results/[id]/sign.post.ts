import { SIGNATURE_MEANINGS } from '#shared/states'
import { eq } from 'drizzle-orm'
import { z } from 'zod'
import { dutyConflict } from '#shared/domain/run-lifecycle'

const body = z.object({
  password: z.string().min(1, 'your password signs this').max(1024),
  reason: z.string().trim().min(3, 'say why').max(2000),
}).strict()

// A supervisor signs a result off (re-authenticated, bound to its inputs and values); never the person who fired or entered it.
export default defineEventHandler(async (event) => {
  const user = await requireRole(event)
  const { id } = parseParams(event, resultIdParam)
  const input = await parseBody(event, body)
  const db = useDb()
  const before = await findResultOr404(db, id)
  const [firing] = await db.select({ firedBy: schema.firings.firedBy }).from(schema.firings).where(eq(schema.firings.id, before.firingId))
  const conflict = dutyConflict(user.id, 'this result', { fired: [firing?.firedBy], entered: [before.createdBy] })
  return signWithPassword(event, user, { entity: 'result', entityId: id, password: input.password, conflict }, signer => db.transaction(async (tx) => {
    const row = await findResultOr404(tx, id, true)
    if (!row.current) throw new Refusal('conflict', `Revision ${row.revision} has been superseded: sign the current revision.`)
    if (row.status === 'signed') throw new Refusal('conflict', 'This result is already signed off; a change needs a new revision.')
    const sig = await signer.sign(tx, { entity: 'result', entityId: id, meaning: SIGNATURE_MEANINGS.resultSignOff, reason: input.reason, boundHash: resultHash(row) })
    const [updated] = await tx.update(schema.results).set({ status: 'signed', signatureId: sig.id }).where(eq(schema.results.id, id)).returning()
    await audit(tx, signer, {
      action: 'result.sign', entity: 'result', entityId: id,
      oldValues: { status: row.status }, newValues: { status: 'signed', revision: row.revision, signature: { id: sig.id, meaning: sig.meaning, signedAt: sig.signedAt, boundHash: sig.boundHash } },
      reason: input.reason,
    })
    const [view] = await loadResultViews(tx, [updated!])
    return view!
  }))
})
