import { eq } from 'drizzle-orm'
import { z } from 'zod'

const body = z.object({
  password: z.string().min(1, 'your password signs this').max(1024),
  reason: z.string().trim().min(3, 'say why').max(2000),
}).strict()

// A supervisor signs a result off (re-authenticated, bound to its inputs and values); never the person who fired or entered it.
export default defineEventHandler(async (event) => {
  const user = await requireRole(event, 'supervisor')
  const { id } = parseParams(event, resultIdParam)
  const input = await parseBody(event, body)
  const db = useDb()
  const before = await findResultOr404(db, id)
  const [firing] = await db.select({ firedBy: schema.firings.firedBy }).from(schema.firings).where(eq(schema.firings.id, before.firingId))
  if (firing?.firedBy === user.id || before.createdBy === user.id) {
    throw createError({ statusCode: 403, message: `You ${firing?.firedBy === user.id ? 'fired this run' : 'entered this result'}: another supervisor must sign it off (separation of duties).` })
  }
  await verifySigner(event, user.id, input.password, 'result', id)
  const signed = await db.transaction(async (tx) => {
    const row = await findResultOr404(tx, id, true)
    if (!row.current) throw createError({ statusCode: 409, message: `Revision ${row.revision} has been superseded: sign the current revision.` })
    if (row.status === 'signed') throw createError({ statusCode: 409, message: 'This result is already signed off; a change needs a new revision.' })
    const [sig] = await tx.insert(schema.signatures).values({
      entity: 'result', entityId: id, signerId: user.id, signerName: user.name, meaning: 'result signed off', reason: input.reason, boundHash: resultHash(row),
    }).returning()
    const [updated] = await tx.update(schema.results).set({ status: 'signed', signatureId: sig!.id }).where(eq(schema.results.id, id)).returning()
    await audit(tx, event, {
      action: 'result.sign', entity: 'result', entityId: id,
      oldValues: { status: row.status }, newValues: { status: 'signed', revision: row.revision, signature: { id: sig!.id, meaning: sig!.meaning, signedAt: sig!.signedAt, boundHash: sig!.boundHash } },
      reason: input.reason,
    })
    const [view] = await loadResultViews(tx, [updated!])
    return view!
  })
  // A fresh session after a signature, as for approvals.
  await renewSession(event)
  return signed
})
