// Servicing records of a vessel: storing them and applying their effect (the rules: shared/domain/vessel-lifecycle.ts).
// Records are never edited: a correction is a new record pointing to the one it corrects.
import { and, asc, desc, eq, inArray, sql } from 'drizzle-orm'
import { correctionEffect, serviceEffect } from '#shared/domain/vessel-lifecycle'
import type { ServiceInput, ServiceKind } from '#shared/schemas/services'
import type { services } from '../database/schema'
import type { Act } from './refusal'
import type { AttachmentRow } from './uploads'
import type { VesselRow } from './vessels'

export type ServiceRow = typeof services.$inferSelect

const REQUIRED_SEALS = ['head', 'valve', 'electrode'] as const
const DAY_MS = 86_400_000
// A record may be a few minutes "ahead" of the server: clocks at the bench drift.
const CLOCK_SLACK_MS = 5 * 60_000
const isoDay = (d: Date) => d.toISOString().slice(0, 10)

/** The rules of a record beyond its shape (422 naming the field); the routine checklist is complete or refused. */
export function checkServiceRules(input: ServiceInput, vessel: VesselRow, now: Date, isCorrection: boolean) {
  const issues: { path: string, message: string }[] = []
  const performedAt = new Date(input.performedAt)
  if (performedAt.getTime() > now.getTime() + CLOCK_SLACK_MS) issues.push({ path: 'performedAt', message: 'must not be in the future' })
  if (input.kind === 'routine') {
    if (input.seals.some(s => !s.renewed)) issues.push({ path: 'seals', message: 'a routine service renews every seal together' })
    const missing = REQUIRED_SEALS.filter(p => !input.seals.some(s => s.position === p))
    if (missing.length) issues.push({ path: 'seals', message: `list every seal of the vessel: no ${missing.join(', ')} seal given` })
    if (!input.valveSeatRenewed) issues.push({ path: 'valveSeatRenewed', message: 'a routine service renews the valve seat' })
    if (!input.leakTest.passed && !input.leakTest.where) issues.push({ path: 'leakTest.where', message: 'say where the bubbles appeared' })
    if (!isCorrection && vessel.lastServicedAt && performedAt < vessel.lastServicedAt) {
      issues.push({ path: 'performedAt', message: `is before the last routine service (${isoDay(vessel.lastServicedAt)}): correct that record instead` })
    }
  }
  if (input.kind === 'requalification') {
    if (input.testedTo < input.testedFrom) issues.push({ path: 'testedTo', message: 'must not be before the first test date' })
    if (new Date(`${input.testedFrom}T00:00:00Z`).getTime() > now.getTime() + DAY_MS) issues.push({ path: 'testedFrom', message: 'must not be in the future' })
    if (!isCorrection && vessel.lastRequalifiedAt && performedAt < vessel.lastRequalifiedAt) {
      issues.push({ path: 'performedAt', message: `is before the last requalification (${isoDay(vessel.lastRequalifiedAt)}): correct that record instead` })
    }
  }
  if (issues.length) invalidInput(issues)
}

/**
 * A lock-out ends only with a passing requalification recorded since it began, or — when a failed leak
 * test or electrode resistance caused it — a routine service since then that passed both checks.
 */
export async function returnToServiceCheck(tx: Tx, vessel: VesselRow): Promise<{ ok: boolean, why: string }> {
  if (vessel.condition !== 'locked-out' || !vessel.conditionSince) return { ok: false, why: 'The vessel is not locked out.' }
  const s = schema.services
  const rows = await tx.select({ kind: s.kind, record: s.record, id: s.id, correctsId: s.correctsId, atLock: sql<boolean>`${s.createdAt} = ${vessel.conditionSince}` })
    .from(s).where(and(eq(s.vesselId, vessel.id), sql`${s.createdAt} >= ${vessel.conditionSince}`)).orderBy(asc(s.createdAt))
  const superseded = new Set(rows.map(r => r.correctsId).filter(Boolean))
  const current = rows.filter(r => !superseded.has(r.id))
  const cause = current.find(r => r.atLock)?.record.effect?.lockCause ?? null
  const after = current.filter(r => !r.atLock)
  if (after.some(r => r.kind === 'requalification' && r.record.passed)) return { ok: true, why: '' }
  if (cause === 'service-check' && after.some(r => r.kind === 'routine' && r.record.effect?.checksPassed)) {
    return { ok: true, why: '' }
  }
  return {
    ok: false,
    why: cause === 'service-check'
      ? 'The lock-out came from a failed leak test or electrode resistance: record a routine service that passes both checks (or a passing requalification) first.'
      : 'Record a passing requalification of the vessel since its lock-out first.',
  }
}

/** The record as stored: the checklist or report without the password and the routing fields. */
function recordBody(input: ServiceInput) {
  const { password: _p, performedAt: _a, correctsId: _c, attachmentIds: _i, kind: _k, ...rest } = input
  return rest
}

/** Firings recorded after a date (bounded by the interval since the last service, so the count stays small). */
async function firingsAfter(tx: Tx, vesselId: string, at: Date): Promise<number> {
  const [row] = await tx.select({ n: sql<number>`count(*)::int` }).from(schema.firings)
    .where(and(eq(schema.firings.vesselId, vesselId), sql`${schema.firings.firedAt} > ${at}`))
  return row?.n ?? 0
}

/** Checks that the uploads belong to this vessel and are not yet part of a record (locked until the record commits). */
async function claimAttachments(tx: Tx, vesselId: string, ids: string[]) {
  if (!ids.length) return []
  const unique = [...new Set(ids)]
  const rows = await tx.select().from(schema.attachments).where(inArray(schema.attachments.id, unique)).for('update')
  const bad = unique.filter((id) => {
    const r = rows.find(x => x.id === id)
    return !r || r.serviceId !== null || !r.storageKey.startsWith(storageKeyPrefix(vesselId))
  })
  if (bad.length) invalidInput([{ path: 'attachmentIds', message: `not an upload of this vessel waiting for a record: ${bad.join(', ')}` }])
  return rows
}

/** Records a servicing record, signed and audited, and applies its effect to the vessel — all in one transaction. */
export async function recordService(act: Act, vesselId: string, input: ServiceInput) {
  const { user } = act
  const policy = await getPolicy()
  return await useDb().transaction(async (tx) => {
    const before = await findVesselOr404(tx, vesselId, true)
    // One instant for the record, its signature and any lock-out it starts (the return-to-service rule compares them).
    const clock = await tx.execute<{ now: Date }>(sql`select now() as now`)
    const at = new Date(clock.rows[0]!.now)
    const isCorrection = !!input.correctsId
    checkServiceRules(input, before, at, isCorrection)

    let original: ServiceRow | undefined
    if (input.correctsId) {
      ;[original] = await tx.select().from(schema.services).where(eq(schema.services.id, input.correctsId)).for('update')
      if (!original || original.vesselId !== vesselId) invalidInput([{ path: 'correctsId', message: 'no such record of this vessel' }])
      if (original.kind !== input.kind) invalidInput([{ path: 'correctsId', message: `a correction has the kind of the record it corrects (${original.kind})` }])
      const [later] = await tx.select({ id: schema.services.id }).from(schema.services).where(eq(schema.services.correctsId, original.id))
      if (later) throw new Refusal('conflict', 'That record is already corrected: correct its latest version.', { correctedById: later.id })
    }
    const files = await claimAttachments(tx, vesselId, input.attachmentIds)

    const effect = isCorrection
      ? correctionEffect(before, input, policy)
      : serviceEffect(before, input, policy, input.kind === 'return-to-service' ? await returnToServiceCheck(tx, before) : { ok: false, why: '' })

    const performedAt = new Date(input.performedAt)
    const change: Partial<VesselRow> = { updatedAt: at }
    if (effect.reset) {
      change.firingsSinceService = await firingsAfter(tx, vesselId, performedAt)
      change.lastServicedAt = performedAt
    }
    if (effect.reset === 'both') {
      change.firingsSinceRequalification = change.firingsSinceService
      change.lastRequalifiedAt = performedAt
    }
    if (effect.condition !== before.condition || effect.lockCause) {
      change.condition = effect.condition
      change.conditionSince = at
    }
    change.conditionReason = effect.condition === 'normal' ? null : effect.reason

    const [row] = await tx.insert(schema.services).values({
      vesselId,
      kind: input.kind,
      record: {
        ...recordBody(input),
        effect: { condition: effect.condition, lockCause: effect.lockCause, checksPassed: effect.checksPassed, message: effect.message },
        signature: { signerName: user.name, signedAt: at.toISOString(), meaning: 'did or witnessed this work and records it as true' },
        ...(input.kind === 'routine' ? { electrodeResistanceLimitOhm: policy.electrodeResistanceMaxOhm } : {}),
      },
      performedAt,
      signedBy: user.id,
      signerName: user.name,
      correctsId: input.correctsId ?? null,
      createdAt: at,
    }).returning()
    const [after] = await tx.update(schema.vessels).set(change).where(eq(schema.vessels.id, vesselId)).returning()
    if (files.length) await tx.update(schema.attachments).set({ serviceId: row!.id }).where(inArray(schema.attachments.id, files.map(f => f.id)))
    await audit(tx, act, {
      action: isCorrection ? `service.correct` : `service.${input.kind}`,
      entity: 'vessel',
      entityId: vesselId,
      oldValues: pickVesselState(before),
      newValues: { service: row, attachments: files.map(f => ({ id: f.id, fileName: f.fileName, contentType: f.contentType })), vessel: pickVesselState(after!) },
      reason: effect.message,
    })
    // A lock-out is mailed now, in this transaction; the fleet check then finds it already told.
    await notifyVesselTransition(tx, act, after!, policy, at)
    const attached = files.length ? await tx.select().from(schema.attachments).where(eq(schema.attachments.serviceId, row!.id)) : []
    return { service: serviceView(row!, attached, null), vessel: vesselView(after!, policy, at), effect: { message: effect.message } }
  })
}

function pickVesselState(v: VesselRow) {
  return {
    condition: v.condition, conditionReason: v.conditionReason, conditionSince: v.conditionSince,
    firingsSinceService: v.firingsSinceService, firingsSinceRequalification: v.firingsSinceRequalification,
    lastServicedAt: v.lastServicedAt, lastRequalifiedAt: v.lastRequalifiedAt,
  }
}

export function serviceView(s: ServiceRow, files: AttachmentRow[], correctedById: string | null) {
  const record = s.record
  return {
    id: s.id,
    vesselId: s.vesselId,
    kind: s.kind as ServiceKind,
    performedAt: s.performedAt,
    record,
    signedBy: s.signedBy,
    signerName: s.signerName,
    signedAt: s.createdAt,
    correctsId: s.correctsId,
    correctedById,
    attachments: files.map(attachmentView),
  }
}
export type ServiceView = ReturnType<typeof serviceView>

/** A vessel's servicing history, newest first, with its files and the correction links both ways. */
export async function listServices(db: Db | Tx, vesselId: string, limit = 500) {
  const rows = await db.select().from(schema.services).where(eq(schema.services.vesselId, vesselId))
    .orderBy(desc(schema.services.performedAt), desc(schema.services.createdAt)).limit(limit)
  const ids = rows.map(r => r.id)
  const files = ids.length ? await db.select().from(schema.attachments).where(inArray(schema.attachments.serviceId, ids)).orderBy(asc(schema.attachments.createdAt)) : []
  const correctedBy = new Map(rows.filter(r => r.correctsId).map(r => [r.correctsId!, r.id]))
  return rows.map(r => serviceView(r, files.filter(f => f.serviceId === r.id), correctedBy.get(r.id) ?? null))
}
