// Recording a firing: the request, its idempotency key and the weighed charge (the act itself: firing-record.ts).
import { createHash } from 'node:crypto'
import type { H3Event } from 'h3'
import { and, eq } from 'drizzle-orm'
import { z } from 'zod'
import { FIRING_OUTCOMES } from '#shared/domain/vessel-lifecycle'
import type { FiringOutcome } from '#shared/domain/vessel-lifecycle'
import type { RunComponent } from '#shared/schemas/plans'
import type { VesselState } from '#shared/domain/vessel-state'
import { Refusal } from './refusal'


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
    id: string, name: string, state: VesselState, condition: string, conditionReason: string | null, stateReasons: string[]
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
  if (row.data.requestHash !== requestHash) {
    throw new Refusal('invalid', 'This Idempotency-Key was already used for a different firing request; use a new key for a new firing.', {
      fields: [{ path: 'Idempotency-Key', message: 'already used for a different request' }],
    })
  }
  return row.answer
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
      const message = 'the planned charge has no combustion aid: edit the run to add one, then submit it again'
      throw new Refusal('invalid', `Invalid input — aidMassG: ${message}`, { fields: [{ path: 'aidMassG', message }] })
    }
    const plannedAid = sumMass(aids)
    aids.forEach((c, i) => { c.massG = plannedAid > 0 ? ((c.massG ?? 0) * body.aidMassG!) / plannedAid : i === 0 ? body.aidMassG : 0 })
    if (aids.length && Math.abs(plannedAid - body.aidMassG) > 5e-5) changes.push(`aid mass ${fmtG(plannedAid)} planned, ${fmtG(body.aidMassG)} weighed`)
  }
  return { components: out, changes }
}
