// Recording a firing (issue 5): idempotent by key, re-assessed on the weighed charge, counted by the database.
import { createHash, randomUUID } from 'node:crypto'
import type { H3Event } from 'h3'
import { and, eq, sql } from 'drizzle-orm'
import { z } from 'zod'
import type { Assessment, Finding } from '#shared/domain/assessment'
import type { RunComponent } from '#shared/schemas/plans'

export const FIRING_OUTCOMES = ['complete', 'incomplete', 'misfire', 'leak', 'overpressure'] as const
export type FiringOutcome = typeof FIRING_OUTCOMES[number]

export const OUTCOME_LABELS: Record<FiringOutcome, string> = {
  complete: 'Complete combustion',
  incomplete: 'Incomplete combustion (soot or unburnt residue)',
  misfire: 'Misfire (no ignition)',
  leak: 'Leak',
  overpressure: 'Overpressure event',
}

/** Outcomes after which the vessel may not be fired again until requalified (DESIGN.md §5). */
export const LOCK_OUT_OUTCOMES: ReadonlySet<FiringOutcome> = new Set(['leak', 'overpressure'])

export const firingBodySchema = z.object({
  outcome: z.enum(FIRING_OUTCOMES, { error: 'one of complete, incomplete, misfire, leak, overpressure' }),
  weighedMassG: z.number({ error: 'the weighed sample mass in g' }).positive('above 0 g').max(100, 'at most 100 g'),
  aidMassG: z.number({ error: 'the weighed aid mass in g' }).min(0, 'not negative').max(100, 'at most 100 g').optional(),
  observations: z.string().trim().max(2000, 'at most 2000 characters').default(''),
}).strict()
export type FiringBody = z.infer<typeof firingBodySchema>

const KEY = /^[\x21-\x7E]{1,200}$/

/** The Idempotency-Key header: required, 1–200 visible ASCII characters (400 naming it otherwise). */
export function idempotencyKey(event: H3Event): string {
  const raw = getRequestHeader(event, 'idempotency-key')
  if (raw === undefined || raw.trim() === '') {
    throw createError({
      statusCode: 400,
      message: 'The Idempotency-Key header is required: send a fresh random key with each new firing, and the same key when you retry it.',
      data: { fields: [{ path: 'Idempotency-Key', message: 'required header' }] },
    })
  }
  const key = raw.trim()
  if (!KEY.test(key)) {
    throw createError({ statusCode: 400, message: 'The Idempotency-Key header must be 1–200 visible ASCII characters.', data: { fields: [{ path: 'Idempotency-Key', message: '1–200 visible ASCII characters' }] } })
  }
  return key
}

/** Fingerprint of a firing request, so that a key reused for a different request is recognised. */
export function firingRequestHash(runId: string, body: FiringBody): string {
  return createHash('sha256').update(JSON.stringify({ runId, outcome: body.outcome, weighedMassG: body.weighedMassG, aidMassG: body.aidMassG ?? null, observations: body.observations })).digest('hex')
}

export interface FiringAnswer {
  id: string
  runId: string
  vesselId: string
  sampleCode: string
  kind: string
  outcome: FiringOutcome
  weighedMassG: number
  aidMassG: number | null
  observations: string
  firedAt: string
  firedBy: { id: string, name: string }
  run: { id: string, status: 'fired' }
  vessel: {
    id: string, name: string, state: string, condition: string, conditionReason: string | null, stateReasons: string[]
    blocksAllFirings: boolean, blocksSampleRuns: boolean
    firingsSinceService: number, firingsSinceRequalification: number, firingsTotal: number
  }
  lockedOut: boolean
  message: string
}

/** The stored first answer for this user's key, or null; 422 when the key was used for another request. Keys are scoped to the user who sent them. */
export async function firingReplay(db: Db | Tx, userId: string, key: string, requestHash: string): Promise<FiringAnswer | null> {
  const [row] = await db.select({ answer: schema.firings.answer, data: schema.firings.data }).from(schema.firings)
    .where(and(eq(schema.firings.firedBy, userId), eq(schema.firings.idempotencyKey, key)))
  if (!row) return null
  if ((row.data as { requestHash?: string }).requestHash !== requestHash) {
    throw createError({
      statusCode: 422,
      message: 'This Idempotency-Key was already used for a different firing request; use a new key for a new firing.',
      data: { fields: [{ path: 'Idempotency-Key', message: 'already used for a different request' }] },
    })
  }
  return row.answer as FiringAnswer
}

const fmtG = (g: number | undefined) => (g === undefined ? '—' : `${g.toFixed(4)} g`)
const sumMass = (cs: RunComponent[]) => cs.reduce((a, c) => a + (c.massG ?? 0), 0)

/**
 * The run's charge with the weighed masses in place of the planned ones: the sample mass (several sample
 * components keep their proportions) and, when given, the aid mass. Returns the changes in words.
 */
export function weighedCharge(components: RunComponent[], body: FiringBody): { components: RunComponent[], changes: string[] } {
  const out = components.map(c => ({ ...c }))
  const changes: string[] = []
  const samples = out.filter(c => c.role === 'sample')
  const planned = sumMass(samples)
  if (samples.length === 1 || planned <= 0) {
    samples.forEach((c, i) => { c.massG = i === 0 ? body.weighedMassG : 0 })
  }
  else {
    samples.forEach((c) => { c.massG = ((c.massG ?? 0) * body.weighedMassG) / planned })
  }
  if (Math.abs(planned - body.weighedMassG) > 5e-5) changes.push(`sample mass ${fmtG(planned)} planned, ${fmtG(body.weighedMassG)} weighed`)
  if (body.aidMassG !== undefined) {
    const aids = out.filter(c => c.role === 'aid')
    if (!aids.length && body.aidMassG > 0) {
      invalidInput([{ path: 'aidMassG', message: 'the planned charge has no combustion aid: edit the run to add one, then submit it again' }])
    }
    const plannedAid = sumMass(aids)
    aids.forEach((c, i) => { c.massG = plannedAid > 0 ? ((c.massG ?? 0) * body.aidMassG!) / plannedAid : i === 0 ? body.aidMassG : 0 })
    if (aids.length && Math.abs(plannedAid - body.aidMassG) > 5e-5) changes.push(`aid mass ${fmtG(plannedAid)} planned, ${fmtG(body.aidMassG)} weighed`)
  }
  return { components: out, changes }
}

/** Findings the weighed charge raises that the planned (and, where needed, signed) charge did not. */
export function newFindings(before: Assessment, after: Assessment): { blocks: Finding[], approvals: Finding[] } {
  const had = (severity: Finding['severity']) => new Set(before.findings.filter(f => f.severity === severity).map(f => f.code))
  const blocksBefore = had('block')
  const approvalsBefore = had('approval')
  return {
    blocks: after.findings.filter(f => f.severity === 'block' && !blocksBefore.has(f.code)),
    approvals: after.findings.filter(f => f.severity === 'approval' && !approvalsBefore.has(f.code)),
  }
}

function vesselRefusal(vessel: VesselView, kind: string) {
  if (vessel.blocksAllFirings || (kind === 'sample' && vessel.blocksSampleRuns)) {
    const what = vessel.blocksAllFirings ? 'may not be fired' : 'may not fire a sample run'
    throw createError({
      statusCode: 409,
      message: `${vessel.name} ${what}: ${vessel.stateReasons[0] ?? vessel.state}`,
      data: { reason: 'vessel', state: vessel.state, stateReasons: vessel.stateReasons },
    })
  }
}

function isUniqueViolation(err: unknown, constraint: string): boolean {
  for (let e: unknown = err; e; e = (e as { cause?: unknown }).cause) {
    const pgErr = e as { code?: string, constraint?: string }
    if (pgErr.code === '23505' && pgErr.constraint === constraint) return true
  }
  return false
}

type Outcome =
  | { kind: 'fired' | 'replay', answer: FiringAnswer }
  | { kind: 'refused', message: string, status: string, findings: Finding[] }

/** POST /api/runs/:id/firing — see the issue: refusals first, then one transaction that records and counts. */
export async function recordFiring(event: H3Event) {
  const user = await requireRole(event, 'analyst')
  const { id } = parseParams(event, idParam)
  const key = idempotencyKey(event)
  const body = await parseBody(event, firingBodySchema)
  const requestHash = firingRequestHash(id, body)
  const db = useDb()

  const replied = (answer: FiringAnswer) => {
    setResponseHeader(event, 'Idempotent-Replayed', 'true')
    setResponseStatus(event, 201)
    return answer
  }
  const first = await firingReplay(db, user.id, key, requestHash)
  if (first) return replied(first)
  const policy = await getPolicy()

  let outcome: Outcome
  try {
    outcome = await db.transaction(async (tx): Promise<Outcome> => {
      const run = await findRunOr404(tx, id, true)
      // A twin request with this key may have committed while this one waited for the run.
      const twin = await firingReplay(tx, user.id, key, requestHash)
      if (twin) return { kind: 'replay', answer: twin }
      if (run.status !== 'ready') {
        const why = run.status === 'fired' ? 'it has already been fired' : run.status === 'awaiting-approval' ? 'it awaits a supervisor\'s signature' : `it is ${run.status}`
        throw createError({ statusCode: 409, message: `Run ${run.sampleCode} cannot be fired: ${why}. Only a run that is ready to fire can be recorded.`, data: { reason: 'run-status', status: run.status } })
      }
      const planned = vesselView(await findVesselOr404(tx, run.vesselId), policy)
      vesselRefusal(planned, run.kind)

      // The weighed charge is assessed as the planned one was: anything new must be dealt with before firing.
      const weighed = weighedCharge(run.components as RunComponent[], body)
      const { assessment, chargeHash } = await assessRun(tx, { vessel: planned, fillPressureMPa: run.fillPressureMPa, components: weighed.components, kind: run.kind }, policy)
      const fresh = newFindings(run.assessment as Assessment, assessment)
      if (fresh.blocks.length || fresh.approvals.length) {
        const status = fresh.blocks.length ? 'blocked' : 'awaiting-approval'
        const now = new Date()
        await tx.update(schema.runs).set({ components: weighed.components, assessment, verdict: assessment.verdict, chargeHash, status, updatedAt: now }).where(eq(schema.runs.id, id))
        await audit(tx, event, {
          action: 'run.reassessed-at-firing', entity: 'run', entityId: id,
          oldValues: { status: run.status, verdict: run.verdict, components: run.components },
          newValues: { status, verdict: assessment.verdict, components: weighed.components, newFindings: [...fresh.blocks, ...fresh.approvals].map(f => f.code) },
          reason: weighed.changes.join('; ') || 'the assessment changed since the run was cleared',
        })
        const changed = weighed.changes.length ? `The weighed charge differs from the plan (${weighed.changes.join('; ')})` : 'The assessment changed since the run was cleared'
        if (status === 'blocked') {
          return { kind: 'refused', status, findings: fresh.blocks, message: `${changed} and is now blocked: ${fresh.blocks.map(f => f.message).join(' ')} Nothing was fired or counted; change the charge or withdraw the run.` }
        }
        const plan = await findPlanOr404(tx, run.planId)
        await enqueueMail(tx, {
          to: await recipientsWithRole(tx, 'supervisor'),
          subject: `Signature needed again: run ${run.sampleCode} in plan "${plan.name}"`,
          text: [
            `${user.name} weighed the charge of run #${run.seq} (${run.sampleCode}) for firing. ${changed}, which raises a finding that needs a supervisor's signature:`,
            '',
            ...fresh.approvals.map(f => `  • ${f.message}`),
            '',
            'The run is back in Approvals. It may be fired only after you sign the exception.',
          ].join('\n'),
          dedupeKey: `run-reapproval:${id}:${chargeHash}`,
        })
        return { kind: 'refused', status, findings: fresh.approvals, message: `${changed}, which needs a supervisor's signature: ${fresh.approvals.map(f => f.message).join(' ')} The run is back awaiting approval and the supervisors have been told; nothing was fired or counted.` }
      }

      // Lock the vessel only now (short hold) and check its state again as it stands under the lock.
      const vesselRow = await findVesselOr404(tx, run.vesselId, true)
      const before = vesselView(vesselRow, policy)
      vesselRefusal(before, run.kind)

      const now = new Date()
      const lockOut = LOCK_OUT_OUTCOMES.has(body.outcome)
      const lockReason = lockOut
        ? `${OUTCOME_LABELS[body.outcome]} on firing of ${run.sampleCode} (run #${run.seq}) recorded by ${user.name} on ${now.toISOString().slice(0, 16).replace('T', ' ')} UTC${body.observations ? `: ${body.observations}` : ''}. Requalify the vessel before any further firing.`
        : null
      const v = schema.vessels
      // The database adds the firing to the counters: concurrent firings each count once.
      const [counted] = await tx.update(v).set({
        firingsSinceService: sql`${v.firingsSinceService} + 1`,
        firingsSinceRequalification: sql`${v.firingsSinceRequalification} + 1`,
        firingsTotal: sql`${v.firingsTotal} + 1`,
        updatedAt: now,
        ...(lockOut ? { condition: 'locked-out', conditionReason: lockReason, conditionSince: now, notifiedState: 'locked-out' } : {}),
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
        lockedOut: lockOut,
        message: lockOut
          ? `Firing recorded. ${after.name} is now locked out after the ${body.outcome}; supervisors and technicians have been told by e-mail.`
          : body.outcome === 'complete'
            ? `Firing recorded on ${after.name}: enter the temperature rise and corrections to get the result.`
            : `Firing recorded on ${after.name} (${OUTCOME_LABELS[body.outcome].toLowerCase()}); this firing gives no result — fire a duplicate.`,
      }
      await tx.insert(schema.firings).values({
        id: firingId, runId: id, vesselId: run.vesselId, idempotencyKey: key, outcome: body.outcome, weighedMassG: body.weighedMassG,
        data: {
          requestHash, aidMassG: body.aidMassG ?? null, observations: body.observations, components: weighed.components,
          plannedComponents: run.components, verdictAtFiring: assessment.verdict, findingsAtFiring: assessment.findings.map(f => f.code),
        },
        answer, firedBy: user.id, firedAt: now,
      })
      await tx.update(schema.runs).set({ status: 'fired', updatedAt: now }).where(eq(schema.runs.id, id))
      await audit(tx, event, {
        action: 'run.fire', entity: 'run', entityId: id,
        oldValues: { status: run.status, vessel: { firingsSinceService: before.firingsSinceService, firingsSinceRequalification: before.firingsSinceRequalification, firingsTotal: before.firingsTotal } },
        newValues: { status: 'fired', firingId, outcome: body.outcome, weighedMassG: body.weighedMassG, aidMassG: body.aidMassG ?? null, vesselId: run.vesselId, vessel: { firingsSinceService: after.firingsSinceService, firingsSinceRequalification: after.firingsSinceRequalification, firingsTotal: after.firingsTotal } },
        reason: body.observations || null,
      })
      if (lockOut) {
        await audit(tx, event, {
          action: 'vessel.lock-out', entity: 'vessel', entityId: run.vesselId,
          oldValues: { condition: before.condition, state: before.state }, newValues: { condition: 'locked-out', state: after.state, firingId },
          reason: lockReason,
        })
        const to = [...await recipientsWithRole(tx, 'supervisor'), ...await recipientsWithRole(tx, 'technician')]
        await enqueueMail(tx, {
          to,
          subject: `Vessel ${after.name} locked out: ${body.outcome} on firing of ${run.sampleCode}`,
          text: [
            `${user.name} recorded a ${body.outcome === 'leak' ? 'leak' : 'an overpressure event'} on the firing of ${run.sampleCode} (run #${run.seq}) in vessel ${after.name} (serial ${counted!.serialNumber}).`,
            body.observations ? `Observations: ${body.observations}` : 'No observations were written.',
            '',
            `Emberline has locked the vessel out: no run can be fired in it until it has been requalified and returned to service.`,
            'Depressurise and open the vessel only as your procedures describe; keep it out of use and tagged.',
            'Local regulations, the vessel maker\'s instructions and the lab\'s own procedures come first.',
          ].join('\n'),
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
      if (winner) return replied(winner)
    }
    if (isUniqueViolation(err, 'firings_run_id_unique')) {
      throw createError({ statusCode: 409, message: 'This run has already been fired.', data: { reason: 'run-status', status: 'fired' } })
    }
    throw err
  }
  if (outcome.kind === 'refused') {
    throw createError({ statusCode: 409, message: outcome.message, data: { reason: 'reassessment', status: outcome.status, findings: outcome.findings } })
  }
  if (outcome.kind === 'replay') return replied(outcome.answer)
  setResponseStatus(event, 201)
  return outcome.answer
}
