import { eq } from 'drizzle-orm'

// Compute and store the result of a fired run (analyst): revision 1; later changes go through a revision.
// A passing check run returns a vessel awaiting verification to service in the same transaction.
export default defineEventHandler(async (event) => {
  const user = await requireRole(event)
  const { id } = parseParams(event, idParam)
  const inputs = await parseBody(event, resultInputSchema)
  const policy = await getPolicy()
  const out = await useDb().transaction(async (tx) => {
    const run = await findRunOr404(tx, id, true)
    if (run.status !== 'fired') throw createError({ statusCode: 409, message: `Run ${run.sampleCode} is ${run.status}: a result needs a recorded firing.` })
    const [existing] = await tx.select({ id: schema.results.id }).from(schema.results).where(eq(schema.results.runId, id)).limit(1)
    if (existing) throw createError({ statusCode: 409, message: 'This run already has a result: change it through a revision with a reason.', data: { resultId: existing.id } })
    const { firing, ctx } = await resultContext(tx, run, policy)
    const values = computeResult(inputs, ctx)
    const [row] = await tx.insert(schema.results).values({
      runId: id, firingId: firing.id, vesselId: run.vesselId, sampleCode: run.sampleCode, kind: run.kind, revision: 1, current: true,
      inputs, values, energyEquivalentId: ctx.energyEquivalent?.id ?? null, status: 'unsigned', createdBy: user.id,
    }).returning()
    await audit(tx, event, {
      action: 'result.create', entity: 'result', entityId: row!.id,
      newValues: { runId: id, sampleCode: run.sampleCode, kind: run.kind, revision: 1, inputs: { ...inputs, thermogram: inputs.thermogram ? { ...inputs.thermogram, csv: `(${inputs.thermogram.csv.length} characters)` } : undefined }, grossJPerG: values.grossJPerG, energyEquivalentJPerK: values.energyEquivalentJPerK, check: values.check },
    })
    const check = await applyCheckOutcome(tx, event, run, values, row!.id)
    const [view] = await loadResultViews(tx, [row!])
    return { result: view!, check }
  })
  setResponseStatus(event, 201)
  return out
})
