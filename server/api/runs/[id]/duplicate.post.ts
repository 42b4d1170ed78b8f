

// A duplicate determination: the same sample and charge as a new run at the end of the plan, re-assessed now.
export default defineEventHandler(async (event) => {
  const user = await requireRole(event)
  const { id } = parseParams(event, idParam)
  const policy = await getPolicy()
  const run = await useDb().transaction(async (tx) => {
    const src = await findRunOr404(tx, id)
    await findPlanOr404(tx, src.planId, true)
    await assertPlanRoom(tx, src.planId, 1, policy, 'runs')
    const vessel = vesselView(await findVesselOr404(tx, src.vesselId), policy)
    const components = src.components
    await refuseCheckRunWithoutEnergyEquivalent(tx, src.kind, vessel)
    const { assessment, chargeHash } = await assessRun(tx, { vessel, fillPressureMPa: src.fillPressureMPa, components, kind: src.kind }, policy)
    const [row] = await insertNumberedRuns(tx, src.planId, [{
      sampleCode: src.sampleCode, kind: src.kind, vesselId: src.vesselId, fillPressureMPa: src.fillPressureMPa,
      components, assessment, verdict: assessment.verdict, chargeHash, status: 'draft', note: src.note, plannedBy: user.id, sampleId: src.sampleId,
    }])
    await audit(tx, event, { action: 'run.duplicate', entity: 'run', entityId: row!.id, newValues: { ...row!, assessment: undefined, duplicateOf: id } })
    await settleSampleStatus(tx, event, src.sampleId, `repeat of ${src.sampleCode} #${src.seq}`, policy)
    return row!
  })
  setResponseStatus(event, 201)
  return runView(run)
})
