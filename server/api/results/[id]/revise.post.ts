import { and, eq } from 'drizzle-orm'

// A result changes only through a new revision with a reason (audited); the old revision stays, no longer current.
export default defineEventHandler(async (event) => {
  const user = await requireRole(event)
  const { id } = parseParams(event, resultIdParam)
  const { reason, ...inputs } = await parseBody(event, resultReviseSchema)
  const policy = await getPolicy()
  const out = await useDb().transaction(async (tx) => {
    const old = await findResultOr404(tx, id, true)
    if (!old.current) throw createError({ statusCode: 409, message: `Revision ${old.revision} has already been superseded: revise the current revision.` })
    const run = await findRunOr404(tx, old.runId, true)
    const { ctx } = await resultContext(tx, run, policy, old.energyEquivalentId)
    const values = computeResult(inputs, ctx)
    await tx.update(schema.results).set({ current: false }).where(eq(schema.results.id, id))
    const [row] = await tx.insert(schema.results).values({
      runId: old.runId, firingId: old.firingId, vesselId: old.vesselId, sampleCode: old.sampleCode, kind: old.kind, revision: old.revision + 1,
      supersedesId: old.id, current: true, inputs, values, energyEquivalentId: old.energyEquivalentId, status: 'unsigned', reason, createdBy: user.id,
    }).returning()
    const summary = (v: ResultValues) => ({ grossJPerG: v.grossJPerG, energyEquivalentJPerK: v.energyEquivalentJPerK, temperatureRiseK: v.temperatureRiseK, sampleMassG: v.sampleMassG, check: v.check })
    await audit(tx, event, {
      action: 'result.revise', entity: 'result', entityId: row!.id,
      oldValues: { id: old.id, revision: old.revision, status: old.status, ...summary(old.values) },
      newValues: { id: row!.id, revision: row!.revision, status: 'unsigned', ...summary(values) },
      reason,
    })
    const check = await applyCheckOutcome(tx, event, run, values, row!.id)
    const warnings: string[] = []
    if (old.status === 'signed') warnings.push('The previous revision was signed off: this revision needs a new sign-off before it can be certified.')
    if (old.kind === 'standardisation') {
      const series = await tx.select({ acceptedAt: schema.energyEquivalents.acceptedAt, resultIds: schema.energyEquivalents.resultIds })
        .from(schema.energyEquivalents).where(and(eq(schema.energyEquivalents.vesselId, old.vesselId), eq(schema.energyEquivalents.active, true)))
      if (series.some(s => s.resultIds.includes(old.id))) warnings.push('The revised run belongs to the accepted energy equivalent: review the series on the Standardisation page.')
    }
    const [view] = await loadResultViews(tx, [row!])
    return { result: view!, check, warnings }
  })
  setResponseStatus(event, 201)
  return out
})
