// Servicing records of a vessel (issue 6): what each kind records, and what it does to the vessel.
// Records are never edited: a correction is a new record pointing to the one it corrects.
import { and, asc, desc, eq, inArray, sql } from 'drizzle-orm'
import { z } from 'zod'
import type { LabPolicy } from '#shared/domain/policy'
import type { VesselCondition } from '#shared/domain/vessel-state'
import type { services } from '../database/schema'
import type { Act } from './refusal'
import type { AttachmentRow } from './uploads'
import type { VesselRow } from './vessels'

export type ServiceRow = typeof services.$inferSelect

export const SERVICE_KINDS = ['routine', 'requalification', 'inspection', 'repair', 'lock-out', 'return-to-service', 'sent-away'] as const
export type ServiceKind = typeof SERVICE_KINDS[number]
export const SEAL_POSITIONS = ['head', 'valve', 'electrode', 'other'] as const
export const SURFACE_CONDITIONS = ['good', 'worn', 'damaged', 'corroded'] as const
/** Why a vessel is locked out; only a failed bench check can be cleared by a passing routine service, the rest need a requalification. */
export type LockCause = 'service-check' | 'damage' | 'requalification-failed' | 'manual'

const text = (max: number) => z.string().trim().max(max, `at most ${max} characters`)
const needed = (max: number, what: string) => text(max).min(1, what)
const dateTime = z.iso.datetime({ offset: true, error: 'a date-time with its offset, e.g. 2026-11-30T14:00:00Z' })
const day = z.iso.date({ error: 'a date as YYYY-MM-DD' })
const part = z.object({
  part: needed(120, 'name the part'),
  lot: needed(60, 'the lot number of the part'),
  quantity: z.number().int('a whole number').min(1, 'at least 1').max(1000).default(1),
}).strict()

const common = {
  performedAt: dateTime,
  password: z.string().min(1, 'your password signs this record').max(1024),
  notes: text(4000).default(''),
  correctsId: z.string().uuid('the id of the record this corrects').optional(),
  attachmentIds: z.array(z.string().uuid('an attachment id (UUID)')).max(20, 'at most 20 files').default([]),
}

export const serviceInputSchema = z.discriminatedUnion('kind', [
  z.object({
    kind: z.literal('routine'),
    ...common,
    seals: z.array(z.object({
      position: z.enum(SEAL_POSITIONS),
      name: needed(80, 'name the seal'),
      renewed: z.boolean(),
      lot: text(60).default(''),
    }).strict()).min(1, 'list the vessel\'s seals').max(30),
    valveSeatRenewed: z.boolean(),
    electrodeInsulators: z.enum(['inspected', 'renewed']),
    packingNutTorqueNm: z.number().positive('above 0').max(100, 'at most 100 N·m'),
    electrodeResistanceOhm: z.number().min(0, 'at least 0').max(10_000_000),
    leakTest: z.object({
      passed: z.boolean(),
      pressureMPa: z.number().positive('above 0').max(20, 'at most 20 MPa'),
      where: text(300).default(''),
    }).strict(),
    sealingSurfaces: z.enum(SURFACE_CONDITIONS),
    threads: z.enum(SURFACE_CONDITIONS),
    partsUsed: z.array(part).max(50).default([]),
  }).strict(),
  z.object({
    kind: z.literal('requalification'),
    ...common,
    body: needed(160, 'name the outside body that tested the vessel'),
    certificateNumber: needed(80, 'the certificate number'),
    testPressureMPa: z.number().positive('above 0').max(200, 'at most 200 MPa'),
    testedFrom: day,
    testedTo: day,
    passed: z.boolean(),
    findings: text(4000).default(''),
  }).strict(),
  z.object({
    kind: z.literal('inspection'),
    ...common,
    findings: needed(4000, 'say what was inspected and found'),
    damageOrCorrosionSeen: z.boolean(),
  }).strict(),
  z.object({
    kind: z.literal('repair'),
    ...common,
    description: needed(4000, 'say what was repaired'),
    partsUsed: z.array(part).max(50).default([]),
  }).strict(),
  z.object({ kind: z.literal('lock-out'), ...common, reason: text(1000).min(3, 'say why the vessel is locked out') }).strict(),
  z.object({ kind: z.literal('return-to-service'), ...common, reason: text(1000).min(3, 'say what ended the lock-out') }).strict(),
  z.object({
    kind: z.literal('sent-away'),
    ...common,
    destination: needed(160, 'where the vessel goes'),
    purpose: text(300).default('requalification'),
  }).strict(),
], { error: `kind must be one of ${SERVICE_KINDS.join(', ')}` })

export type ServiceInput = z.output<typeof serviceInputSchema>

const REQUIRED_SEALS = ['head', 'valve', 'electrode'] as const
const DAY_MS = 86_400_000
// A record may be a few minutes "ahead" of the server: clocks at the bench drift.
const CLOCK_SLACK_MS = 5 * 60_000
const fmt = (n: number, d = 0) => n.toLocaleString('en-GB', { minimumFractionDigits: d, maximumFractionDigits: d })
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

/** What a record does to its vessel: counters reset, dates, condition and its reason. */
export interface ServiceEffect {
  reset: 'service' | 'both' | null
  condition: VesselCondition
  /** Set when this record (re)locks the vessel out. */
  lockCause: LockCause | null
  reason: string | null
  /** True when a routine service passed its leak test and electrode resistance check. */
  checksPassed?: boolean
  message: string
}

function conflict(message: string): never {
  throw new Refusal('conflict', message)
}

/** Locks out, or keeps an existing lock-out; a failed bench check never replaces a lock-out that needs requalification. */
function lock(vessel: VesselRow, cause: LockCause, reason: string, extra: Partial<ServiceEffect> = {}): ServiceEffect {
  if (vessel.condition === 'locked-out' && cause === 'service-check') {
    return { reset: null, condition: 'locked-out', lockCause: null, reason: vessel.conditionReason, ...extra, message: `Recorded. The vessel stays locked out: ${reason}` }
  }
  return { reset: null, condition: 'locked-out', lockCause: cause, reason, ...extra, message: `Recorded. The vessel is locked out: ${reason}` }
}

/** After any service: only standardisation and check runs until a check run passes (DESIGN.md §5). */
const AWAIT_CHECK = 'Awaiting a passing check run: only standardisation or check runs until then.'

/**
 * The effect of a new (not correcting) record on its vessel, or 409 when the vessel's condition does not allow it.
 * Return to service needs `returnAllowed` (see returnToServiceCheck).
 */
export function serviceEffect(vessel: VesselRow, input: ServiceInput, policy: LabPolicy, returnAllowed: { ok: boolean, why: string }): ServiceEffect {
  const c = vessel.condition as VesselCondition
  if (c === 'retired') conflict('The vessel is retired: no servicing records are added to it.')
  if (c === 'away' && input.kind !== 'requalification') {
    conflict('The vessel is away for requalification: record its requalification when it comes back.')
  }
  const keepLock = c === 'locked-out'
  switch (input.kind) {
    case 'routine': {
      const problems: string[] = []
      if (!input.leakTest.passed) problems.push(`the leak test under water failed (bubbles at ${input.leakTest.where}); never fire a vessel with a failed leak test.`)
      if (input.electrodeResistanceOhm > policy.electrodeResistanceMaxOhm) {
        problems.push(`the electrode resistance of ${fmt(input.electrodeResistanceOhm, 2)} Ω is above the limit of ${fmt(policy.electrodeResistanceMaxOhm, 2)} Ω.`)
      }
      const damaged = [['sealing surfaces', input.sealingSurfaces], ['threads', input.threads]].filter(([, v]) => v === 'damaged' || v === 'corroded')
      if (damaged.length) {
        const seen = damaged.map(([w, v]) => `${v} ${w}`).join(' and ')
        return lock(vessel, 'damage', `${seen} seen at the routine service; the vessel must be requalified.${problems.length ? ` Also: ${problems.join(' ')}` : ''}`, { checksPassed: false })
      }
      if (problems.length) return lock(vessel, 'service-check', `at the routine service ${problems.join(' Also, ')}`, { checksPassed: false })
      if (keepLock) {
        return { reset: 'service', condition: 'locked-out', lockCause: null, reason: vessel.conditionReason, checksPassed: true, message: 'Routine service recorded and the service counter reset. The vessel stays locked out until a return to service is signed.' }
      }
      return { reset: 'service', condition: 'awaiting-verification', lockCause: null, reason: `Routine seal service recorded for ${isoDay(new Date(input.performedAt))}.`, checksPassed: true, message: `Routine service recorded: the service counter is reset. ${AWAIT_CHECK}` }
    }
    case 'requalification': {
      if (!input.passed) return lock(vessel, 'requalification-failed', `the requalification by ${input.body} failed (certificate ${input.certificateNumber}).`)
      if (keepLock) {
        return { reset: 'both', condition: 'locked-out', lockCause: null, reason: vessel.conditionReason, message: 'Requalification recorded and both counters reset. The vessel stays locked out until a technician signs its return to service.' }
      }
      return { reset: 'both', condition: 'awaiting-verification', lockCause: null, reason: `Requalified by ${input.body} (certificate ${input.certificateNumber}) on ${isoDay(new Date(input.performedAt))}.`, message: `Requalification recorded: both counters are reset. ${AWAIT_CHECK}` }
    }
    case 'inspection':
      if (input.damageOrCorrosionSeen) return lock(vessel, 'damage', `damage or corrosion seen at inspection: ${input.findings}`)
      return { reset: null, condition: c, lockCause: null, reason: vessel.conditionReason, message: 'Inspection recorded. The vessel\'s condition is unchanged.' }
    case 'repair':
      if (keepLock) return { reset: null, condition: c, lockCause: null, reason: vessel.conditionReason, message: 'Repair recorded. The vessel stays locked out until a return to service is signed.' }
      return { reset: null, condition: 'awaiting-verification', lockCause: null, reason: `Repaired on ${isoDay(new Date(input.performedAt))}.`, message: `Repair recorded. ${AWAIT_CHECK}` }
    case 'lock-out':
      if (keepLock) conflict('The vessel is already locked out.')
      return lock(vessel, 'manual', input.reason)
    case 'return-to-service':
      if (!keepLock) conflict('Only a locked-out vessel is returned to service.')
      if (!returnAllowed.ok) conflict(returnAllowed.why)
      return { reset: null, condition: 'awaiting-verification', lockCause: null, reason: `Lock-out ended: ${input.reason}`, message: `Lock-out ended. ${AWAIT_CHECK}` }
    case 'sent-away':
      return { reset: null, condition: 'away', lockCause: null, reason: `Sent to ${input.destination} for ${input.purpose}.`, message: 'Recorded: the vessel is away and cannot be planned or fired until its requalification is recorded.' }
  }
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
  const cause = (current.find(r => r.atLock)?.record as { effect?: { lockCause?: LockCause } } | undefined)?.effect?.lockCause ?? null
  const after = current.filter(r => !r.atLock)
  if (after.some(r => r.kind === 'requalification' && (r.record as { passed?: boolean }).passed)) return { ok: true, why: '' }
  if (cause === 'service-check' && after.some(r => r.kind === 'routine' && (r.record as { effect?: { checksPassed?: boolean } }).effect?.checksPassed)) {
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

/**
 * A correction fixes the record, not the past: it never resets counters or lifts a condition, but a
 * corrected record that shows a failed check, damage or a failed requalification still locks the vessel out.
 */
function correctionEffect(vessel: VesselRow, input: ServiceInput, policy: LabPolicy): ServiceEffect {
  const same = { reset: null, condition: vessel.condition as VesselCondition, lockCause: null, reason: vessel.conditionReason, message: 'Correction recorded. Counters and condition are unchanged by a correction.' }
  if (vessel.condition === 'retired') return same
  let danger: { cause: LockCause, reason: string } | null = null
  if (input.kind === 'routine') {
    const bad = [input.sealingSurfaces, input.threads].some(v => v === 'damaged' || v === 'corroded')
    if (bad) danger = { cause: 'damage', reason: 'damage or corrosion shown by a corrected routine service record; the vessel must be requalified.' }
    else if (!input.leakTest.passed || input.electrodeResistanceOhm > policy.electrodeResistanceMaxOhm) danger = { cause: 'service-check', reason: 'a corrected routine service record shows a failed leak test or electrode resistance above the limit.' }
  }
  if (input.kind === 'requalification' && !input.passed) danger = { cause: 'requalification-failed', reason: `the corrected requalification record shows a failed test (certificate ${input.certificateNumber}).` }
  if (input.kind === 'inspection' && input.damageOrCorrosionSeen) danger = { cause: 'damage', reason: `damage or corrosion in a corrected inspection record: ${input.findings}` }
  if (!danger) return same
  const e = lock(vessel, danger.cause, danger.reason)
  return { ...e, message: `Correction recorded. ${e.message.replace(/^Recorded\. /, '')}` }
}

function pickVesselState(v: VesselRow) {
  return {
    condition: v.condition, conditionReason: v.conditionReason, conditionSince: v.conditionSince,
    firingsSinceService: v.firingsSinceService, firingsSinceRequalification: v.firingsSinceRequalification,
    lastServicedAt: v.lastServicedAt, lastRequalifiedAt: v.lastRequalifiedAt,
  }
}

export function serviceView(s: ServiceRow, files: AttachmentRow[], correctedById: string | null) {
  const record = s.record as Record<string, unknown> & { effect?: { message?: string, condition?: string, lockCause?: LockCause | null, checksPassed?: boolean } }
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
