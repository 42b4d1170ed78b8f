// The check or standardisation firings a day plan puts first on a vessel, made into real runs when the plan is
// accepted: the ones already waiting on that vessel first, else new ones of benzoic acid from the library at the
// suggested mass, on a plan of their own, numbered, linked to the day plan and ready for the analyst to fire.
import { and, asc, eq, inArray, isNull } from 'drizzle-orm'
import type { H3Event } from 'h3'
import { REFERENCE_STANDARD_CATEGORY } from '#shared/domain/run-lifecycle'
import type { LabPolicy } from '#shared/domain/policy'
import type { PlannedFiring } from '#shared/domain/day-plan'

/** The library's benzoic acid (C7H6O2, category "reference standard"): what check and standardisation runs burn. */
async function benzoicAcid(tx: Tx, path: string) {
  const [m] = await tx.select({ id: schema.materials.id }).from(schema.materials)
    .where(and(eq(schema.materials.category, REFERENCE_STANDARD_CATEGORY), eq(schema.materials.formula, 'C7H6O2'))).orderBy(asc(schema.materials.createdAt)).limit(1)
  if (!m) invalidInput([{ path, message: 'the library holds no benzoic acid of category "reference standard": a supervisor adds it in Materials before the check runs can be planned' }])
  return m!.id
}

/**
 * Check or standardisation runs already planned on the vessel and waiting (not fired, on no day plan) take the first
 * slots of their kind, so that no reference standard is planned twice. Returns the slots still without a run.
 */
async function placeWaitingChecks(tx: Tx, event: H3Event, at: { dayPlanId: string, day: string, vessel: VesselView, slots: PlannedFiring[] }) {
  const left: PlannedFiring[] = []
  const waiting = await tx.select().from(schema.runs)
    .where(and(eq(schema.runs.vesselId, at.vessel.id), inArray(schema.runs.kind, ['check', 'standardisation']), inArray(schema.runs.status, [...OPEN_FOR_DAY_PLAN]), isNull(schema.runs.dayPlanId)))
    .orderBy(asc(schema.runs.createdAt), asc(schema.runs.seq)).for('update')
  for (const slot of at.slots) {
    const i = waiting.findIndex(r => r.kind === slot.kind)
    if (i < 0) {
      left.push(slot)
      continue
    }
    const [run] = waiting.splice(i, 1)
    await tx.update(schema.runs).set({ dayPlanId: at.dayPlanId, dayOrder: slot.order, updatedAt: new Date() }).where(eq(schema.runs.id, run!.id))
    await audit(tx, event, { action: 'run.schedule', entity: 'run', entityId: run!.id, oldValues: { dayPlanId: null }, newValues: { vesselId: at.vessel.id, dayPlanId: at.dayPlanId, dayOrder: slot.order, day: at.day, status: run!.status }, reason: slot.why })
    slot.runId = run!.id
    slot.label = `${run!.sampleCode} #${run!.seq}`
  }
  return left
}

/**
 * Creates one run for each firing of `slots` (the ones without a run) on the vessel, in the day plan's order, with its
 * audit rows; fills in each slot's run id. Check runs need the vessel's accepted energy equivalent (422 otherwise).
 */
export async function createDayPlanChecks(tx: Tx, event: H3Event, at: { dayPlanId: string, day: string, vessel: VesselView, slots: PlannedFiring[] }, policy: LabPolicy) {
  const { vessel, day, dayPlanId } = at
  const slots = await placeWaitingChecks(tx, event, at)
  if (!slots.length) return
  const path = `assignment.${vessel.id}`
  const materialId = await benzoicAcid(tx, path)
  const kinds = new Set(slots.map(s => s.kind))
  for (const kind of kinds) await refuseCheckRunWithoutEnergyEquivalent(tx, kind, vessel, path)
  const user = event.context.user!
  const what = kinds.has('standardisation') ? 'Standardisation' : 'Check run'
  const [plan] = await tx.insert(schema.plans).values({
    name: `${what} before the day — ${vessel.name}, ${day}`, vesselId: vessel.id, fillPressureMPa: policy.defaultFillPressureMPa,
    note: `Placed first by the day plan of ${day}.`, createdBy: user.id, submittedAt: new Date(),
  }).returning()
  await audit(tx, event, { action: 'plan.create', entity: 'plan', entityId: plan!.id, newValues: { name: plan!.name, vesselId: vessel.id, dayPlanId } })
  for (const slot of slots) {
    const { components, assessment, chargeHash } = await suggestedCharge(tx, { role: 'sample', materialId }, slot.kind, vessel, plan!.fillPressureMPa, policy)
    const code = `${slot.kind === 'check' ? 'CHK' : 'STD'}-${day}-${vessel.name}`.slice(0, 80)
    const [row] = await insertNumberedRuns(tx, plan!.id, [{
      sampleCode: code, kind: slot.kind, vesselId: vessel.id, fillPressureMPa: plan!.fillPressureMPa, components, assessment,
      verdict: assessment.verdict, chargeHash, status: statusForVerdict(assessment.verdict), note: slot.why, plannedBy: user.id,
      submittedBy: [user.id], dayPlanId, dayOrder: slot.order,
    }])
    await audit(tx, event, { action: 'run.create', entity: 'run', entityId: row!.id, newValues: { ...row!, assessment: undefined, verdict: assessment.verdict }, reason: slot.why })
    slot.runId = row!.id
    slot.label = `${code} #${row!.seq}`
  }
}
