import { eq } from 'drizzle-orm'
import { runPatchSchema } from '#shared/schemas/plans'
import { runActRefusal, withHandler } from '#shared/domain/run-lifecycle'

// Editing a run re-assesses it and sends it back to draft: a signature given to the old charge no longer holds,
// and the editor joins those who may not sign it.

export default defineEventHandler(async (event) => {
  const user = await requireRole(event)
  const { id } = parseParams(event, idParam)
  const input = await parseBody(event, runPatchSchema)
  const policy = await getPolicy()
  const run = await useDb().transaction(async (tx) => {
    const before = await findRunOr404(tx, id, true)
    const refusal = runActRefusal('edit', before.status, before.sampleCode)
    if (refusal) throw createError({ statusCode: 409, message: refusal, data: { reason: 'run-status', status: before.status } })
    const plan = await findPlanOr404(tx, before.planId)
    const vesselId = input.vesselId ?? before.vesselId ?? plan.vesselId
    const vessel = vesselView(await findVesselOr404(tx, vesselId), policy)
    const fillPressureMPa = input.fillPressureMPa ?? before.fillPressureMPa
    const components = input.components ?? before.components
    const kind = input.kind ?? before.kind
    await refuseCheckRunWithoutEnergyEquivalent(tx, kind, vessel)
    const { assessment, chargeHash } = await assessRun(tx, { vessel, fillPressureMPa, components, kind }, policy)
    const [row] = await tx.update(schema.runs).set({
      sampleCode: input.sampleCode ?? before.sampleCode, kind, vesselId, fillPressureMPa, components, note: input.note ?? before.note,
      assessment, verdict: assessment.verdict, chargeHash, status: 'draft', statusReason: null,
      editedBy: before.plannedBy === user.id ? before.editedBy : withHandler(before.editedBy, user.id), updatedAt: new Date(),
    }).where(eq(schema.runs.id, id)).returning()
    await audit(tx, event, {
      action: 'run.update', entity: 'run', entityId: id,
      oldValues: { ...before, assessment: undefined }, newValues: { ...row!, assessment: undefined },
    })
    return row!
  })
  const sigs = await signaturesFor(useDb(), [id])
  return runView(run, sigs.get(id))
})
