import { eq } from 'drizzle-orm'
import { runInputSchema } from '#shared/schemas/plans'
import type { RunInput } from '#shared/schemas/plans'

// Editing a run re-assesses it and sends it back to draft: a signature given to the old charge no longer holds.
const EDITABLE = new Set(['draft', 'ready', 'awaiting-approval', 'blocked', 'rejected'])

export default defineEventHandler(async (event) => {
  await requireRole(event, 'analyst')
  const { id } = parseParams(event, idParam)
  const input = await parseBody(event, runInputSchema.partial())
  const policy = await getPolicy()
  const run = await useDb().transaction(async (tx) => {
    const before = await findRunOr404(tx, id, true)
    if (!EDITABLE.has(before.status)) throw createError({ statusCode: 409, message: `A ${before.status} run cannot be changed.` })
    const plan = await findPlanOr404(tx, before.planId)
    const vesselId = input.vesselId ?? before.vesselId ?? plan.vesselId
    const vessel = vesselView(await findVesselOr404(tx, vesselId), policy)
    const fillPressureMPa = input.fillPressureMPa ?? before.fillPressureMPa
    const components = input.components ?? (before.components as RunInput['components'])
    const kind = input.kind ?? before.kind
    await refuseCheckRunWithoutEnergyEquivalent(tx, kind, vessel)
    const { assessment, chargeHash } = await assessRun(tx, { vessel, fillPressureMPa, components, kind }, policy)
    const [row] = await tx.update(schema.runs).set({
      sampleCode: input.sampleCode ?? before.sampleCode, kind, vesselId, fillPressureMPa, components, note: input.note ?? before.note,
      assessment, verdict: assessment.verdict, chargeHash, status: 'draft', updatedAt: new Date(),
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
