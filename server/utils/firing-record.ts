// Recording a firing: idempotent by key, the weighed charge held against what was signed, counted by the database.
import { randomUUID } from 'node:crypto'
import { eq, sql } from 'drizzle-orm'
import type { Finding } from '#shared/domain/assessment'
import { runActRefusal, withHandler } from '#shared/domain/run-lifecycle'
import { findingChanges, massExcess, sampleMassG } from '#shared/domain/signed-charge'
import { firingEffect, lockOutReason, OUTCOME_LABELS } from '#shared/domain/vessel-lifecycle'
import type { FiringAnswer, FiringBody } from './firing'
import type { Act } from './refusal'

/** The meaning of the signature that clears an exception (written by `signRun`). */
const APPROVED = 'approved as an exception'

function vesselRefusal(vessel: VesselView, kind: string) {
  if (vessel.blocksAllFirings || (kind === 'sample' && vessel.blocksSampleRuns)) {
    const what = vessel.blocksAllFirings ? 'may not be fired' : 'may not fire a sample run'
    throw new Refusal('conflict', `${vessel.name} ${what}: ${vessel.stateReasons[0] ?? vessel.state}`, { reason: 'vessel', state: vessel.state, stateReasons: vessel.stateReasons })
  }
}

function isUniqueViolation(err: unknown, constraint: string): boolean {
  for (let e: unknown = err; e; e = (e as { cause?: unknown }).cause) {
    const pgErr = e as { code?: string, constraint?: string }
    if (pgErr.code === '23505' && pgErr.constraint === constraint) return true
  }
  return false
}

export interface FiringRecord { replayed: boolean, answer: FiringAnswer }

type Outcome =
  | { kind: 'fired' | 'replay', answer: FiringAnswer }
  | { kind: 'refused', message: string, status: string, findings: Finding[], statusReason: string }

/**
 * Records the firing of a ready run. Refusals first (status, vessel, the weighed charge against the signed one), then
 * one transaction that records the firing, counts it on the vessel and applies its outcome. A weighed charge that a
 * signature no longer covers goes back for a new signature (committed) and the firing is refused.
 */
export async function recordFiring(act: Act, id: string, key: string, body: FiringBody, requestHash: string): Promise<FiringRecord> {
  const { user } = act
  const db = useDb()
  const first = await firingReplay(db, user.id, key, requestHash)
  if (first) return { replayed: true, answer: first }
  const policy = await getPolicy()
  if (body.weighedMassG < policy.minSampleMassG) {
    const message = `at least ${policy.minSampleMassG} g (the lab's smallest sample mass)`
    throw new Refusal('invalid', `Invalid input — weighedMassG: ${message}`, { fields: [{ path: 'weighedMassG', message }] })
  }

  let outcome: Outcome
  try {
    outcome = await db.transaction(async (tx): Promise<Outcome> => {
      const run = await findRunOr404(tx, id, true)
      // A twin request with this key may have committed while this one waited for the run.
      const twin = await firingReplay(tx, user.id, key, requestHash)
      if (twin) return { kind: 'replay', answer: twin }
      const refusal = runActRefusal('fire', run.status, run.sampleCode)
      if (refusal) throw new Refusal('conflict', `${refusal} Only a run that is ready to fire can be recorded.`, { reason: 'run-status', status: run.status })
      const planned = vesselView(await findVesselOr404(tx, run.vesselId), policy)
      vesselRefusal(planned, run.kind)

      // The weighed charge is assessed as the planned one was, and held against the charge as signed.
      const weighed = weighedCharge(run.components, body)
      const { assessment, chargeHash } = await assessRun(tx, { vessel: planned, fillPressureMPa: run.fillPressureMPa, components: weighed.components, kind: run.kind }, policy)
      const signatures = (await signaturesFor(tx, [id])).get(id) ?? []
      const signed = signatures.some(s => s.meaning === APPROVED && s.boundHash === run.chargeHash)
      const tolerance = policy.signedMassTolerancePct
      const fresh = findingChanges(run.assessment, assessment, tolerance, signed)
      const mass = massExcess(sampleMassG(run.components), body.weighedMassG, tolerance)
      // A heavier charge than signed needs a new signature only while it still needs one at all.
      const beyondSignature = signed && mass.exceeded && assessment.verdict !== 'clear'
      if (fresh.blocks.length || fresh.approvals.length || beyondSignature) {
        const status = fresh.blocks.length || assessment.verdict === 'blocked' ? 'blocked' : 'awaiting-approval'
        const why = [beyondSignature ? `${mass.words}.` : null, ...[...fresh.blocks, ...fresh.approvals].map(f => f.message)].filter((x): x is string => !!x)
        const statusReason = status === 'blocked'
          ? `Blocked at the firing: ${why.join(' ')}`
          : `New signature needed at the firing: ${why.join(' ')}`
        const now = new Date()
        await tx.update(schema.runs).set({
          components: weighed.components, assessment, verdict: assessment.verdict, chargeHash, status, statusReason,
          editedBy: withHandler(run.editedBy, user.id), updatedAt: now,
        }).where(eq(schema.runs.id, id))
        await audit(tx, act, {
          action: 'run.reassessed-at-firing', entity: 'run', entityId: id,
          oldValues: { status: run.status, verdict: run.verdict, components: run.components },
          newValues: { status, verdict: assessment.verdict, components: weighed.components, newFindings: [...fresh.blocks, ...fresh.approvals].map(f => f.code), ...(beyondSignature ? { massExcessPct: mass.excessPct } : {}) },
          reason: statusReason,
        })
        const changed = weighed.changes.length ? `The weighed charge differs from the plan (${weighed.changes.join('; ')})` : 'The assessment changed since the run was cleared'
        if (status === 'blocked') {
          return { kind: 'refused', status, statusReason, findings: fresh.blocks, message: `${changed} and is now blocked: ${fresh.blocks.map(f => f.message).join(' ')} Nothing was fired or counted; change the charge or withdraw the run.` }
        }
        const plan = await findPlanOr404(tx, run.planId)
        await enqueueMail(tx, {
          to: await recipientsWithRole(tx, 'supervisor'),
          ...signatureNeededAgainMail({ by: user.name, planName: plan.name, seq: run.seq, sampleCode: run.sampleCode, why }),
          dedupeKey: `run-reapproval:${id}:${chargeHash}`,
        })
        return { kind: 'refused', status, statusReason, findings: fresh.approvals, message: `${changed}: a supervisor's signature is needed again before it is fired — ${why.join(' ')} The run is back awaiting approval and the supervisors have been told; nothing was fired or counted.` }
      }

      // Lock the vessel only now (short hold) and check its state again as it stands under the lock.
      const vesselRow = await findVesselOr404(tx, run.vesselId, true)
      const before = vesselView(vesselRow, policy)
      vesselRefusal(before, run.kind)

      const now = new Date()
      const effect = firingEffect(body.outcome)
      const lockReason = effect.lockOut ? lockOutReason({ outcome: body.outcome, sampleCode: run.sampleCode, seq: run.seq, firedByName: user.name, at: now, observations: body.observations }) : null
      const v = schema.vessels
      // The database adds the firing to the counters: concurrent firings each count once.
      const [counted] = await tx.update(v).set({
        firingsSinceService: sql`${v.firingsSinceService} + ${effect.counts}`,
        firingsSinceRequalification: sql`${v.firingsSinceRequalification} + ${effect.counts}`,
        firingsTotal: sql`${v.firingsTotal} + ${effect.counts}`,
        updatedAt: now,
        ...(effect.lockOut ? { condition: 'locked-out', conditionReason: lockReason, conditionSince: now, notifiedState: 'locked-out' } : {}),
      }).where(eq(v.id, run.vesselId)).returning()
      const after = vesselView(counted!, policy, now)

      const firingId = randomUUID()
      const answer: FiringAnswer = {
        id: firingId,
        runId: id,
        vesselId: run.vesselId,
        sampleCode: run.sampleCode,
        kind: run.kind,
        outcome: body.outcome,
        weighedMassG: body.weighedMassG,
        aidMassG: body.aidMassG ?? null,
        observations: body.observations,
        firedAt: now.toISOString(),
        firedBy: { id: user.id, name: user.name },
        run: { id, status: 'fired' },
        vessel: {
          id: after.id, name: after.name, state: after.state, condition: after.condition, conditionReason: after.conditionReason, stateReasons: after.stateReasons,
          blocksAllFirings: after.blocksAllFirings, blocksSampleRuns: after.blocksSampleRuns,
          firingsSinceService: after.firingsSinceService, firingsSinceRequalification: after.firingsSinceRequalification, firingsTotal: after.firingsTotal,
        },
        lockedOut: effect.lockOut,
        message: effect.lockOut
          ? `Firing recorded. ${after.name} is now locked out after the ${body.outcome}; supervisors and technicians have been told by e-mail.`
          : effect.givesResult
            ? `Firing recorded on ${after.name}: enter the temperature rise and corrections to get the result.`
            : `Firing recorded on ${after.name} (${OUTCOME_LABELS[body.outcome].toLowerCase()}); this firing gives no result — fire a duplicate.`,
      }
      await tx.insert(schema.firings).values({
        id: firingId, runId: id, vesselId: run.vesselId, idempotencyKey: key, outcome: body.outcome, weighedMassG: body.weighedMassG,
        data: {
          requestHash, aidMassG: body.aidMassG ?? null, observations: body.observations, components: weighed.components,
          plannedComponents: run.components, verdictAtFiring: assessment.verdict, findingsAtFiring: assessment.findings.map(f => f.code),
          ...(signed ? { signedMassG: mass.signedG, massExcessPct: mass.excessPct } : {}),
        },
        answer, firedBy: user.id, firedAt: now,
      })
      await tx.update(schema.runs).set({ status: 'fired', statusReason: null, updatedAt: now }).where(eq(schema.runs.id, id))
      await audit(tx, act, {
        action: 'run.fire', entity: 'run', entityId: id,
        oldValues: { status: run.status, vessel: { firingsSinceService: before.firingsSinceService, firingsSinceRequalification: before.firingsSinceRequalification, firingsTotal: before.firingsTotal } },
        newValues: { status: 'fired', firingId, outcome: body.outcome, weighedMassG: body.weighedMassG, aidMassG: body.aidMassG ?? null, vesselId: run.vesselId, vessel: { firingsSinceService: after.firingsSinceService, firingsSinceRequalification: after.firingsSinceRequalification, firingsTotal: after.firingsTotal } },
        reason: body.observations || null,
      })
      await settleSampleStatus(tx, act, run.sampleId, `firing of ${run.sampleCode} #${run.seq}`, policy)
      if (effect.lockOut) {
        await audit(tx, act, {
          action: 'vessel.lock-out', entity: 'vessel', entityId: run.vesselId,
          oldValues: { condition: before.condition, state: before.state }, newValues: { condition: 'locked-out', state: after.state, firingId },
          reason: lockReason,
        })
        const to = [...await recipientsWithRole(tx, 'supervisor'), ...await recipientsWithRole(tx, 'technician')]
        await enqueueMail(tx, {
          to,
          ...lockOutMail({ by: user.name, outcome: body.outcome, sampleCode: run.sampleCode, seq: run.seq, vesselId: run.vesselId, vesselName: after.name, serialNumber: counted!.serialNumber, observations: body.observations }),
          dedupeKey: `firing-lock-out:${firingId}`,
        })
      }
      return { kind: 'fired', answer }
    })
  }
  catch (err) {
    // Two requests with one key at the same instant: the loser answers with the winner's answer.
    if (isUniqueViolation(err, 'firings_user_idempotency_key_idx')) {
      const winner = await firingReplay(db, user.id, key, requestHash)
      if (winner) return { replayed: true, answer: winner }
    }
    if (isUniqueViolation(err, 'firings_run_id_unique')) {
      throw new Refusal('conflict', 'This run has already been fired.', { reason: 'run-status', status: 'fired' })
    }
    throw err
  }
  if (outcome.kind === 'refused') {
    throw new Refusal('conflict', outcome.message, { reason: 'reassessment', status: outcome.status, statusReason: outcome.statusReason, findings: outcome.findings })
  }
  return { replayed: outcome.kind === 'replay', answer: outcome.answer }
}
