import { runInputSchema } from '#shared/schemas/plans'

// Adds a run to a plan; the server assesses it against its vessel as it stands and stores the assessment.
export default defineEventHandler(async (event) => {
  const user = await requireRole(event)
  const { id } = parseParams(event, idParam)
  const input = await parseBody(event, runInputSchema)
  const policy = await getPolicy()
  const run = await useDb().transaction(async (tx) => {
    const plan = await findPlanOr404(tx, id, true)
    await assertPlanRoom(tx, id, 1, policy, 'runs')
    const vesselId = input.vesselId ?? plan.vesselId
    const vessel = vesselView(await findVesselOr404(tx, vesselId), policy)
    const fillPressureMPa = input.fillPressureMPa ?? plan.fillPressureMPa
    await refuseCheckRunWithoutEnergyEquivalent(tx, input.kind, vessel)
    const { assessment, chargeHash } = await assessRun(tx, { vessel, fillPressureMPa, components: input.components, kind: input.kind }, policy)
    const [row] = await insertNumberedRuns(tx, id, [{
      sampleCode: input.sampleCode, kind: input.kind, vesselId, fillPressureMPa,
      components: input.components, assessment, verdict: assessment.verdict, chargeHash, status: 'draft', note: input.note, plannedBy: user.id,
    }])
    await audit(tx, event, { action: 'run.create', entity: 'run', entityId: row!.id, newValues: { ...row!, assessment: undefined, verdict: assessment.verdict } })
    return row!
  })
  setResponseStatus(event, 201)
  return runView(run)
})
