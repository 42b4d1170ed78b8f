// Results of fired runs on the server: loading what a computation needs, storing and showing results. The computation
// itself (values, corrections, uncertainty budget) is shared/domain/results/compute.ts.
import { createHash } from 'node:crypto'
import { and, desc, eq, inArray } from 'drizzle-orm'
import type { SQL } from 'drizzle-orm'
import { z } from 'zod'
import { resolveComponents } from '../../shared/domain/assessment'
import type { LabPolicy } from '../../shared/domain/policy'
import { computeResultValues, ResultInputError, resultContextFrom } from '../../shared/domain/results'
import type { ResultContextParts } from '../../shared/domain/results'
import type * as domain from '../../shared/domain/results'
import * as inputSchemas from '../../shared/schemas/results'
import { checkRunEffect } from '../../shared/domain/vessel-lifecycle'

export type ResultRow = typeof schema.results.$inferSelect
export type EnergyEquivalentRow = typeof schema.energyEquivalents.$inferSelect
export type ResultKind = domain.ResultKind
export type ResultValues = domain.ResultValues
export type ResultContext = domain.ResultContext
export type ResultInputs = inputSchemas.ResultInputs
export const resultInputSchema = inputSchemas.resultInputSchema
export const resultReviseSchema = inputSchemas.resultReviseSchema

const blankToUndefined = (v: unknown) => (typeof v === 'string' && v.trim() === '' ? undefined : v)
/** Filters of the results list and its CSV export. */
export const resultListQuery = z.object({
  sampleCode: z.preprocess(blankToUndefined, z.string().trim().max(80).optional()),
  vesselId: z.preprocess(blankToUndefined, z.string().uuid('a vessel id (UUID)').optional()),
  kind: z.preprocess(blankToUndefined, z.enum(['sample', 'standardisation', 'check']).optional()),
  status: z.preprocess(blankToUndefined, z.enum(['unsigned', 'signed']).optional()),
  includeSuperseded: z.preprocess(blankToUndefined, z.enum(['0', '1']).default('0')),
  limit: z.coerce.number().int('a whole number').min(1).max(1000, 'at most 1000').default(200),
})

export function resultListWhere(q: z.output<typeof resultListQuery>) {
  const r = schema.results
  const where: SQL[] = []
  if (q.sampleCode) where.push(eq(r.sampleCode, q.sampleCode))
  if (q.vesselId) where.push(eq(r.vesselId, q.vesselId))
  if (q.kind) where.push(eq(r.kind, q.kind))
  if (q.status) where.push(eq(r.status, q.status))
  if (q.includeSuperseded === '0') where.push(eq(r.current, true))
  return and(...where)
}

export const resultIdParam = z.object({ id: z.string().uuid('a result id (UUID)') })

/** The whole computation of one result; answers 422 naming the input when a figure is impossible. */
export function computeResult(inputs: ResultInputs, ctx: ResultContext): ResultValues {
  try {
    return computeResultValues(inputs, ctx)
  }
  catch (err) {
    if (err instanceof ResultInputError) invalidInput([{ path: err.path, message: err.message }])
    if (err instanceof RangeError) invalidInput([{ path: '(inputs)', message: err.message }])
    throw err
  }
}

/**
 * Loads what a result of this run needs: the firing, the weighed charge resolved, the ε in force, the aid's value and
 * the lab's duplicate scatter. A run with a result keeps the ε of its first revision; a first result takes the vessel's
 * active ε. The parts are what the result form previews with (GET /api/runs/[id]/result-context).
 */
export async function resultContextParts(db: Db | Tx, run: RunRow, energyEquivalentId?: string | null) {
  const [firing] = await db.select().from(schema.firings).where(eq(schema.firings.runId, run.id))
  if (!firing) throw createError({ statusCode: 409, message: `Run ${run.sampleCode} has not been fired yet: record the firing first.` })
  if (firing.outcome !== 'complete') {
    throw createError({ statusCode: 409, message: `The firing of ${run.sampleCode} was recorded as "${firing.outcome}": it gives no valid result. Fire a duplicate of the run.` })
  }
  const weighed = firing.data.components ?? run.components
  const charge = await buildCharge(db, weighed)
  let components: ResultContext['components']
  try {
    components = await resolveComponents(charge)
  }
  catch {
    components = charge
  }
  const kind = run.kind as ResultKind
  const energy = kind === 'standardisation' ? null : energyEquivalentId ? await energyEquivalentById(db, energyEquivalentId) : await activeEnergyEquivalent(db, run.vesselId)
  if (kind !== 'standardisation' && !energy) {
    const [v] = await db.select({ name: schema.vessels.name }).from(schema.vessels).where(eq(schema.vessels.id, run.vesselId))
    throw createError({
      statusCode: 409,
      message: `${v?.name ?? 'This vessel'} has no accepted energy equivalent: standardise the vessel first (a series of benzoic-acid standardisation runs accepted by a supervisor on the Standardisation page).`,
      data: { reason: 'no-energy-equivalent' },
    })
  }
  const parts: ResultContextParts = {
    kind, weighedMassG: firing.weighedMassG, components,
    energyEquivalent: energy ? { id: energy.id, valueJPerK: energy.valueJPerK, standardDeviationJPerK: energy.standardDeviationJPerK, runs: energy.runs, acceptedAt: energy.acceptedAt } : null,
    aid: await aidValueFor(db, weighed.find(c => c.role === 'aid')?.materialId ?? null),
    cotton: await cottonValue(db),
    labRepeatability: await labRepeatability(db),
  }
  return { firing, parts }
}

/** The firing and the whole context of a result of this run under the policy in force. */
export async function resultContext(db: Db | Tx, run: RunRow, policy: LabPolicy, energyEquivalentId?: string | null) {
  const { firing, parts } = await resultContextParts(db, run, energyEquivalentId)
  return { firing, ctx: resultContextFrom(parts, policy) }
}

export async function activeEnergyEquivalent(db: Db | Tx, vesselId: string): Promise<EnergyEquivalentRow | null> {
  const [row] = await db.select().from(schema.energyEquivalents)
    .where(and(eq(schema.energyEquivalents.vesselId, vesselId), eq(schema.energyEquivalents.active, true)))
    .orderBy(desc(schema.energyEquivalents.acceptedAt)).limit(1)
  return row ?? null
}

async function energyEquivalentById(db: Db | Tx, id: string): Promise<EnergyEquivalentRow | null> {
  const [row] = await db.select().from(schema.energyEquivalents).where(eq(schema.energyEquivalents.id, id))
  return row ?? null
}

/** Binds a sign-off to the inputs and values of one revision. */
export function resultHash(r: Pick<ResultRow, 'id' | 'inputs' | 'values' | 'revision'>): string {
  return createHash('sha256').update(JSON.stringify({ id: r.id, revision: r.revision, inputs: r.inputs, values: r.values })).digest('hex')
}

/** A check run that passes returns a vessel awaiting verification to service (rule: checkRunEffect), in the caller's transaction. */
export async function applyCheckOutcome(tx: Tx, event: Parameters<typeof audit>[1], run: RunRow, values: ResultValues, resultId: string) {
  if (run.kind !== 'check' || !values.check) return null
  const vessel = await findVesselOr404(tx, run.vesselId, true)
  const effect = checkRunEffect(vessel, run.sampleCode, values.check)
  if (!effect.returnedToService) return { returnedToService: false, message: effect.message }
  const now = new Date()
  await tx.update(schema.vessels).set({ condition: 'normal', conditionReason: effect.reason, conditionSince: now, updatedAt: now }).where(eq(schema.vessels.id, vessel.id))
  await audit(tx, event, {
    action: 'vessel.return-to-service', entity: 'vessel', entityId: vessel.id,
    oldValues: { condition: vessel.condition }, newValues: { condition: 'normal', checkResultId: resultId, deviationPct: values.check.deviationPct },
    reason: effect.reason,
  })
  return { returnedToService: true, message: effect.message }
}

type SignatureRow = typeof schema.signatures.$inferSelect

export function resultView(r: ResultRow, extra: { vesselName?: string, createdByName?: string, firedAt?: Date | null, firedBy?: string | null, firedByName?: string | null, signature?: SignatureRow | null } = {}) {
  const values = r.values
  return {
    id: r.id,
    runId: r.runId,
    firingId: r.firingId,
    vesselId: r.vesselId,
    vesselName: extra.vesselName ?? null,
    sampleCode: r.sampleCode,
    kind: r.kind as ResultKind,
    revision: r.revision,
    supersedesId: r.supersedesId,
    current: r.current,
    inputs: r.inputs,
    values,
    energyEquivalentId: r.energyEquivalentId,
    status: r.status as 'unsigned' | 'signed',
    reason: r.reason,
    createdBy: r.createdBy,
    createdByName: extra.createdByName ?? null,
    createdAt: r.createdAt,
    firedAt: extra.firedAt ?? null,
    firedBy: extra.firedBy ?? null,
    firedByName: extra.firedByName ?? null,
    signature: extra.signature
      ? { id: extra.signature.id, signerName: extra.signature.signerName, meaning: extra.signature.meaning, reason: extra.signature.reason, signedAt: extra.signature.signedAt, valid: extra.signature.boundHash === resultHash(r) }
      : null,
  }
}
export type ResultView = ReturnType<typeof resultView>

/** Result rows with their vessel, author, firing and signature, as the API shows them. */
export async function loadResultViews(db: Db | Tx, rows: ResultRow[]): Promise<ResultView[]> {
  if (!rows.length) return []
  const vesselIds = [...new Set(rows.map(r => r.vesselId))]
  const userIds = [...new Set(rows.map(r => r.createdBy))]
  const firingIds = [...new Set(rows.map(r => r.firingId))]
  const sigIds = rows.flatMap(r => (r.signatureId ? [r.signatureId] : []))
  const [vs, us, fs, ss] = await Promise.all([
    db.select({ id: schema.vessels.id, name: schema.vessels.name }).from(schema.vessels).where(inArray(schema.vessels.id, vesselIds)),
    db.select({ id: schema.users.id, name: schema.users.name }).from(schema.users).where(inArray(schema.users.id, userIds)),
    db.select({ id: schema.firings.id, firedAt: schema.firings.firedAt, firedBy: schema.firings.firedBy, name: schema.users.name })
      .from(schema.firings).innerJoin(schema.users, eq(schema.users.id, schema.firings.firedBy)).where(inArray(schema.firings.id, firingIds)),
    sigIds.length ? db.select().from(schema.signatures).where(inArray(schema.signatures.id, sigIds)) : Promise.resolve([] as SignatureRow[]),
  ])
  const vName = new Map(vs.map(v => [v.id, v.name]))
  const uName = new Map(us.map(u => [u.id, u.name]))
  const fById = new Map(fs.map(f => [f.id, f]))
  const sById = new Map(ss.map(s => [s.id, s]))
  return rows.map((r) => {
    const f = fById.get(r.firingId)
    return resultView(r, {
      vesselName: vName.get(r.vesselId), createdByName: uName.get(r.createdBy), firedAt: f?.firedAt ?? null, firedBy: f?.firedBy ?? null, firedByName: f?.name ?? null,
      signature: r.signatureId ? sById.get(r.signatureId) ?? null : null,
    })
  })
}

export async function findResultOr404(db: Db | Tx, id: string, lock = false): Promise<ResultRow> {
  const q = db.select().from(schema.results).where(eq(schema.results.id, id))
  const [row] = lock ? await q.for('update') : await q
  if (!row) throw createError({ statusCode: 404, message: 'No such result.' })
  return row
}
