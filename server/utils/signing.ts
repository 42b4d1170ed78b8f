import { SIGNATURE_MEANINGS, type SignatureEntity, type SignatureMeaning } from '#shared/states'
import type { H3Event } from 'h3'
import { eq } from 'drizzle-orm'
import { runActRefusal, runDutyConflict } from '#shared/domain/run-lifecycle'
import { signatureSchema } from '#shared/schemas/plans'
import type { Act } from './refusal'

export interface SignRequest {
  entity: string
  entityId: string
  password: string
  /** The separation-of-duties sentence when the signer had a hand in the record (403), or null. */
  conflict?: string | null
}

export interface Signer extends Act {
  /** Writes the signature row inside the caller's transaction. */
  sign: (tx: Tx, s: { entity: SignatureEntity, entityId: string, meaning: SignatureMeaning, reason: string, boundHash: string }) => Promise<typeof schema.signatures.$inferSelect>
}

/**
 * Every electronic signature goes through here: separation of duties, re-authentication with the signer's own
 * password, the act itself (which writes the signature row and its audit row in one transaction), session renewal.
 * Refusals of the act become 403/404/409/422 and renew nothing.
 */
export async function signWithPassword<T>(event: H3Event, user: AuthedUser, req: SignRequest, act: (signer: Signer) => Promise<T>): Promise<T> {
  if (req.conflict) throw createError({ statusCode: 403, message: req.conflict, data: { reason: 'separation-of-duties' } })
  await verifySigner(event, user.id, req.password, req.entity, req.entityId)
  const signer: Signer = {
    ...actOf(event, user),
    sign: async (tx, s) => {
      const [row] = await tx.insert(schema.signatures).values({ ...s, signerId: user.id, signerName: user.name }).returning()
      return row!
    },
  }
  const result = await answering(() => act(signer))
  // A fresh cookie for the same session row after a signature.
  await renewSession(event)
  return result
}

type Decision = 'approve' | 'reject'
const MEANING: Record<Decision, SignatureMeaning> = { approve: SIGNATURE_MEANINGS.approve, reject: SIGNATURE_MEANINGS.reject }

/**
 * A supervisor's decision on a run awaiting approval, bound to the charge and its assessment as they stand now;
 * a changed charge or assessment must be asked for again (the run is re-assessed and the refusal says so).
 */
export async function signRun(signer: Signer, decision: Decision, id: string, input: { reason: string, chargeHash?: string }) {
  const policy = await getPolicy()
  const { user } = signer
  const outcome = await useDb().transaction(async (tx) => {
    const run = await findRunOr404(tx, id, true)
    const conflict = runDutyConflict(run, user.id)
    if (conflict) throw new Refusal('forbidden', conflict, { reason: 'separation-of-duties' })
    const refusal = runActRefusal(decision, run.status, run.sampleCode)
    if (refusal) throw new Refusal('conflict', run.status === 'blocked' ? 'A blocked run can never be approved: the analyst must change the charge or withdraw the run.' : refusal, { reason: 'run-status', status: run.status })
    if (input.chargeHash && input.chargeHash !== run.chargeHash) {
      throw new Refusal('conflict', 'The charge changed after you opened it: review the current charge and sign again.')
    }
    // Re-assess now: a vessel or policy change since the request means the request must be reviewed again.
    const vessel = vesselView(await findVesselOr404(tx, run.vesselId), policy)
    const { assessment, chargeHash } = await assessRun(tx, { vessel, fillPressureMPa: run.fillPressureMPa, components: run.components, kind: run.kind }, policy)
    if (chargeHash !== run.chargeHash) {
      const status = statusForVerdict(assessment.verdict)
      await tx.update(schema.runs).set({ assessment, verdict: assessment.verdict, chargeHash, status, updatedAt: new Date() }).where(eq(schema.runs.id, id))
      await audit(tx, signer, { action: 'run.reassessed', entity: 'run', entityId: id, oldValues: { verdict: run.verdict, status: run.status }, newValues: { verdict: assessment.verdict, status }, reason: 'assessment changed before the signature' })
      return { changed: true as const, status }
    }
    const sig = await signer.sign(tx, { entity: 'run', entityId: id, meaning: MEANING[decision], reason: input.reason, boundHash: run.chargeHash })
    const status = decision === 'approve' ? 'ready' : 'rejected'
    const [row] = await tx.update(schema.runs).set({ status, statusReason: null, updatedAt: new Date() }).where(eq(schema.runs.id, id)).returning()
    await audit(tx, signer, {
      action: decision === 'approve' ? 'run.approve' : 'run.reject', entity: 'run', entityId: id,
      oldValues: { status: run.status }, newValues: { status, signature: { id: sig.id, meaning: sig.meaning, signedAt: sig.signedAt, boundHash: sig.boundHash } },
      reason: input.reason,
    })
    if (decision === 'reject') await settleSampleStatus(tx, signer, run.sampleId, `rejection of ${run.sampleCode} #${run.seq}`, policy)
    const [planner] = await tx.select({ email: schema.users.email, active: schema.users.active }).from(schema.users).where(eq(schema.users.id, run.plannedBy))
    const [plan] = await tx.select({ name: schema.plans.name }).from(schema.plans).where(eq(schema.plans.id, run.planId))
    if (planner?.active) {
      await enqueueMail(tx, {
        to: [planner.email],
        ...runDecisionMail({ by: user.name, approved: decision === 'approve', meaning: MEANING[decision], seq: run.seq, sampleCode: run.sampleCode, planId: run.planId, planName: plan?.name ?? '', reason: input.reason }),
        dedupeKey: `run-decision:${sig.id}`,
      })
    }
    const sigs = await signaturesFor(tx, [id])
    return { changed: false as const, run: runView(row!, sigs.get(id)) }
  })
  if (outcome.changed) {
    throw new Refusal('conflict', `The assessment of this run changed since it was submitted (now: ${outcome.status}). Review it again.`, { reason: 'reassessed', status: outcome.status })
  }
  return outcome.run
}

/** POST /api/runs/:id/approve and /reject: supervisor, signed with the password, never by anyone who handled the run. */
export function runDecisionHandler(decision: Decision) {
  return defineEventHandler(async (event) => {
    const user = await requireRole(event)
    const { id } = parseParams(event, idParam)
    const input = await parseBody(event, signatureSchema)
    const current = await findRunOr404(useDb(), id)
    return signWithPassword(event, user, { entity: 'run', entityId: id, password: input.password, conflict: runDutyConflict(current, user.id) },
      signer => signRun(signer, decision, id, input))
  })
}
