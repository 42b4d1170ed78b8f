import type { H3Event } from 'h3'
import { eq } from 'drizzle-orm'
import { signatureSchema } from '#shared/schemas/plans'
import type { RunInput } from '#shared/schemas/plans'

type Decision = 'approve' | 'reject'
const MEANING: Record<Decision, string> = { approve: 'approved as an exception', reject: 'rejected' }

/**
 * A supervisor's electronic signature on a run awaiting approval (issue 4): re-authentication, separation of
 * duties, bound to the charge and its assessment as they stand; a changed charge must be asked for again.
 */
export async function signRun(event: H3Event, decision: Decision) {
  const user = await requireRole(event, 'supervisor')
  const { id } = parseParams(event, idParam)
  const input = await parseBody(event, signatureSchema)
  const db = useDb()
  const current = await findRunOr404(db, id)
  if (current.plannedBy === user.id) {
    throw createError({ statusCode: 403, message: 'You planned this run: another supervisor must sign its exception (separation of duties).' })
  }
  await verifySigner(event, user.id, input.password, 'run', id)
  const policy = await getPolicy()

  const outcome = await db.transaction(async (tx) => {
    const run = await findRunOr404(tx, id, true)
    if (run.status === 'blocked') throw createError({ statusCode: 409, message: 'A blocked run can never be approved: the analyst must change the charge or withdraw the run.' })
    if (run.status !== 'awaiting-approval') throw createError({ statusCode: 409, message: `This run is ${run.status}, not awaiting a signature.` })
    if (input.chargeHash && input.chargeHash !== run.chargeHash) {
      throw createError({ statusCode: 409, message: 'The charge changed after you opened it: review the current charge and sign again.' })
    }
    // Re-assess now: a vessel or policy change since the request means the request must be reviewed again.
    const vessel = vesselView(await findVesselOr404(tx, run.vesselId), policy)
    const { assessment, chargeHash } = await assessRun(tx, { vessel, fillPressureMPa: run.fillPressureMPa, components: run.components as RunInput['components'], kind: run.kind }, policy)
    if (chargeHash !== run.chargeHash) {
      const status = statusForVerdict(assessment.verdict)
      await tx.update(schema.runs).set({ assessment, verdict: assessment.verdict, chargeHash, status, updatedAt: new Date() }).where(eq(schema.runs.id, id))
      await audit(tx, event, { action: 'run.reassessed', entity: 'run', entityId: id, oldValues: { verdict: run.verdict, status: run.status }, newValues: { verdict: assessment.verdict, status }, reason: 'assessment changed before the signature' })
      return { changed: true as const, status }
    }
    const [sig] = await tx.insert(schema.signatures).values({
      entity: 'run', entityId: id, signerId: user.id, signerName: user.name, meaning: MEANING[decision], reason: input.reason, boundHash: run.chargeHash,
    }).returning()
    const status = decision === 'approve' ? 'ready' : 'rejected'
    const [row] = await tx.update(schema.runs).set({ status, updatedAt: new Date() }).where(eq(schema.runs.id, id)).returning()
    await audit(tx, event, {
      action: decision === 'approve' ? 'run.approve' : 'run.reject', entity: 'run', entityId: id,
      oldValues: { status: run.status }, newValues: { status, signature: { id: sig!.id, meaning: sig!.meaning, signedAt: sig!.signedAt, boundHash: sig!.boundHash } },
      reason: input.reason,
    })
    const [planner] = await tx.select({ email: schema.users.email, active: schema.users.active }).from(schema.users).where(eq(schema.users.id, run.plannedBy))
    const [plan] = await tx.select({ name: schema.plans.name }).from(schema.plans).where(eq(schema.plans.id, run.planId))
    if (planner?.active) {
      await enqueueMail(tx, {
        to: [planner.email],
        subject: `Run ${run.sampleCode} ${decision === 'approve' ? 'approved — ready to fire' : 'rejected'}`,
        text: `${user.name} ${MEANING[decision]} run #${run.seq} (${run.sampleCode}) in plan "${plan?.name ?? ''}".\nReason: ${input.reason}\n\n${decision === 'approve' ? 'The run is ready to fire.' : 'Change the charge and submit again, or withdraw the run.'}`,
        dedupeKey: `run-decision:${sig!.id}`,
      })
    }
    const sigs = await signaturesFor(tx, [id])
    return { changed: false as const, run: runView(row!, sigs.get(id)) }
  })
  if (outcome.changed) {
    throw createError({ statusCode: 409, message: `The assessment of this run changed since it was submitted (now: ${outcome.status}). Review it again.` })
  }
  // A fresh session after a signature (issue 7: sessions renewed at signature).
  await renewSession(event)
  return outcome.run
}
