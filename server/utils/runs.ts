import { createHash } from 'node:crypto'
import { and, asc, count, eq, inArray, max } from 'drizzle-orm'
import { z } from 'zod'
import { assess, chargeInputSchema, ChargeInputError } from '#shared/domain/assessment'
import type { Assessment, AssessmentSummary, ChargeComponentInput } from '#shared/domain/assessment'
import type { LabPolicy } from '#shared/domain/policy'
import { componentFromMaterial } from '#shared/material-component'
import { runKindProblems } from '#shared/domain/run-lifecycle'
import type { RunComponent, RunStatus } from '#shared/schemas/plans'
import type { plans, runs } from '../database/schema'

export type RunRow = typeof runs.$inferSelect
export type PlanRow = typeof plans.$inferSelect

export const idParam = z.object({ id: z.string().uuid('an id (UUID)') })

/** The verdict decides where a submitted run goes: clear → ready, needs approval → awaiting a signature, blocked. */
export function statusForVerdict(verdict: Assessment['verdict']): RunStatus {
  return verdict === 'clear' ? 'ready' : verdict === 'needs-approval' ? 'awaiting-approval' : 'blocked'
}

/**
 * Fills each component from its material and turns a run into a charge for the assessment; with the run's kind,
 * a standardisation or check run that does not burn the lab's reference standard is refused (422 naming the sample).
 */
export async function buildCharge(db: Db | Tx, components: RunComponent[], kind?: string): Promise<ChargeComponentInput[]> {
  const ids = [...new Set(components.flatMap(c => c.materialId ? [c.materialId] : []))]
  const found = ids.length ? await db.select().from(schema.materials).where(inArray(schema.materials.id, ids)) : []
  const byId = new Map(found.map(m => [m.id, m]))
  const issues: { path: string, message: string }[] = []
  const out = components.map((c, i) => {
    const { materialId, ...rest } = c
    if (!materialId) return rest as ChargeComponentInput
    const m = byId.get(materialId)
    if (!m) {
      issues.push({ path: `components.${i}.materialId`, message: 'no such material' })
      return rest as ChargeComponentInput
    }
    return componentFromMaterial(m, rest, c.role)
  })
  if (kind) {
    const samples = components.flatMap((c, index) => {
      if (c.role !== 'sample') return []
      const m = c.materialId ? byId.get(c.materialId) : undefined
      return [{ index, materialId: c.materialId, materialName: m?.name, category: m?.category, description: c.name }]
    })
    for (const p of runKindProblems(kind, samples)) issues.push({ path: p.index < 0 ? 'components' : `components.${p.index}.materialId`, message: p.message })
  }
  if (issues.length) invalidInput(issues)
  return out
}

/** Assesses a run on the server (authoritative) against its vessel as it stands now. */
export async function assessRun(db: Db | Tx, input: { vessel: VesselView, fillPressureMPa: number, components: RunComponent[], kind: string }, policy: LabPolicy) {
  const components = await buildCharge(db, input.components, input.kind)
  const parsed = chargeInputSchema.safeParse({
    vessel: assessmentVessel(input.vessel),
    fillPressureMPa: input.fillPressureMPa,
    components,
    runRole: input.kind,
  })
  if (!parsed.success) invalidInput(parsed.error.issues)
  // The schema drops `library` from any request; the server's own material record is attached again here.
  parsed.data.components.forEach((c, i) => {
    const library = components[i]?.library
    if (library) (c as ChargeComponentInput).library = library
  })
  try {
    const assessment = await assess(parsed.data, policy)
    return { assessment, chargeHash: chargeHash(input.vessel.id, input.fillPressureMPa, input.components, assessment) }
  }
  catch (err) {
    if (err instanceof ChargeInputError) invalidInput(err.issues.map(i => ({ path: i.path.join('.'), message: i.message })))
    throw err
  }
}

/** Binds a signature to the charge and its assessment: any change to either changes the hash. */
export function chargeHash(vesselId: string, fillPressureMPa: number, components: RunComponent[], a: Assessment) {
  const material = JSON.stringify({ vesselId, fillPressureMPa, components, verdict: a.verdict, findings: a.findings.map(f => [f.code, f.severity, f.message]) })
  return createHash('sha256').update(material).digest('hex')
}

export async function findRunOr404(db: Db | Tx, id: string, lock = false): Promise<RunRow> {
  const q = db.select().from(schema.runs).where(eq(schema.runs.id, id))
  const [row] = lock ? await q.for('update') : await q
  if (!row) throw createError({ statusCode: 404, message: 'No such run.' })
  return row
}

export async function findPlanOr404(db: Db | Tx, id: string, lock = false): Promise<PlanRow> {
  const q = db.select().from(schema.plans).where(eq(schema.plans.id, id))
  const [row] = lock ? await q.for('update') : await q
  if (!row) throw createError({ statusCode: 404, message: 'No such plan.' })
  return row
}

export type NewRun = Omit<typeof schema.runs.$inferInsert, 'planId' | 'seq'>

/**
 * Inserts runs at the end of their plan, numbered after the last one. The plan row is locked, so concurrent insertions
 * queue instead of reading the same last number; the unique index on (plan, number) stands behind it.
 */
export async function insertNumberedRuns(tx: Tx, planId: string, values: NewRun[]): Promise<RunRow[]> {
  if (!values.length) return []
  await findPlanOr404(tx, planId, true)
  const [last] = await tx.select({ seq: max(schema.runs.seq) }).from(schema.runs).where(eq(schema.runs.planId, planId))
  const start = last?.seq ?? 0
  return await tx.insert(schema.runs).values(values.map((v, i) => ({ ...v, planId, seq: start + i + 1 }))).returning()
}

type SignatureRow = typeof schema.signatures.$inferSelect

/** A run as the API answers it; `assessment` is the stored one, or its summary when the caller selected only that. */
export function runView<R extends Omit<RunRow, 'assessment'> & { assessment: AssessmentSummary }>(r: R, signatures: SignatureRow[] = []) {
  return {
    id: r.id,
    planId: r.planId,
    seq: r.seq,
    sampleCode: r.sampleCode,
    kind: r.kind,
    vesselId: r.vesselId,
    fillPressureMPa: r.fillPressureMPa,
    components: r.components,
    status: r.status as RunStatus,
    verdict: r.verdict,
    assessment: r.assessment,
    chargeHash: r.chargeHash,
    note: r.note,
    plannedBy: r.plannedBy,
    editedBy: r.editedBy,
    submittedBy: r.submittedBy,
    statusReason: r.statusReason,
    createdAt: r.createdAt,
    updatedAt: r.updatedAt,
    signatures: signatures.map(s => ({ id: s.id, signerName: s.signerName, meaning: s.meaning, reason: s.reason, signedAt: s.signedAt, current: s.boundHash === r.chargeHash })),
  }
}

export async function signaturesFor(db: Db | Tx, runIds: string[]) {
  if (!runIds.length) return new Map<string, SignatureRow[]>()
  // With the entity named, the (entity, entity_id) index answers it.
  const rows = await db.select().from(schema.signatures).where(and(eq(schema.signatures.entity, 'run'), inArray(schema.signatures.entityId, runIds))).orderBy(asc(schema.signatures.signedAt))
  const map = new Map<string, SignatureRow[]>()
  for (const s of rows) {
    const list = map.get(s.entityId)
    if (list) list.push(s)
    else map.set(s.entityId, [s])
  }
  return map
}

/** 422 naming `field` when adding `adding` runs would take the plan past the policy's ceiling (maxRunsPerPlan). */
export async function assertPlanRoom(tx: Db | Tx, planId: string, adding: number, policy: LabPolicy, field: string) {
  const [row] = await tx.select({ n: count() }).from(schema.runs).where(eq(schema.runs.planId, planId))
  const n = row?.n ?? 0
  if (n + adding > policy.maxRunsPerPlan) {
    invalidInput([{ path: field, message: `the plan holds ${n} runs and the lab policy allows at most ${policy.maxRunsPerPlan} per plan${adding > 1 ? ` (this adds ${adding})` : ''}: start a new plan for the rest` }])
  }
}

/**
 * Re-authentication for an electronic signature: the signer's own password, checked again under the same throttle as
 * sign-in (server/utils/throttle.ts: a throttled attempt answers 429 without computing the hash); audited on failure.
 */
export async function verifySigner(event: Parameters<typeof requireUser>[0], userId: string, password: string, entity: string, entityId: string) {
  const db = useDb()
  const [u] = await db.select().from(schema.users).where(eq(schema.users.id, userId))
  let ok: boolean
  try {
    ok = !!u && await checkPasswordThrottled(event, u.email, 'signature', u.passwordHash, password)
  }
  catch (err) {
    if (!(err instanceof ThrottledError)) throw err
    await db.transaction(tx => audit(tx, event, { action: 'signature.throttled', entity, entityId, newValues: { rule: err.rule, retryAfterS: err.retryAfterS } }))
    throw throttledAnswer(event, err, 'signing with your password')
  }
  if (!u || !ok) {
    await db.transaction(tx => audit(tx, event, { action: 'signature.password-wrong', entity, entityId }))
    throw createError({ statusCode: 403, message: 'The password is wrong: nothing was signed.', data: { fields: [{ path: 'password', message: 'wrong password' }] } })
  }
  return u
}
