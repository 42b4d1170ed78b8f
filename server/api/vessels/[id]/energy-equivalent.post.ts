import { and, eq, inArray } from 'drizzle-orm'
import { mean, seriesStatistics } from '#shared/domain/results'

// A supervisor accepts a standardisation series (signed): its mean ε becomes the vessel's active energy equivalent.
export default defineEventHandler(async (event) => {
  const user = await requireRole(event, 'supervisor')
  const { id } = parseParams(event, vesselIdParam)
  const input = await parseBody(event, acceptSeriesSchema)
  const db = useDb()
  await findVesselOr404(db, id)
  await verifySigner(event, user.id, input.password, 'vessel', id)
  const policy = await getPolicy()
  const accepted = await db.transaction(async (tx) => {
    const vessel = await findVesselOr404(tx, id, true)
    const rows = await tx.select().from(schema.results).where(inArray(schema.results.id, input.resultIds)).for('update')
    const byId = new Map(rows.map(r => [r.id, r]))
    const problems = input.resultIds.flatMap((rid, i) => {
      const r = byId.get(rid)
      if (!r) return [{ path: `resultIds.${i}`, message: 'no such result' }]
      if (r.kind !== 'standardisation') return [{ path: `resultIds.${i}`, message: `${r.sampleCode} is a ${r.kind} result, not a standardisation run` }]
      if (r.vesselId !== id) return [{ path: `resultIds.${i}`, message: `${r.sampleCode} was fired in another vessel` }]
      if (!r.current) return [{ path: `resultIds.${i}`, message: `${r.sampleCode} revision ${r.revision} has been superseded` }]
      return []
    })
    if (problems.length) invalidInput(problems)
    const firings = await tx.select({ firedBy: schema.firings.firedBy }).from(schema.firings).where(inArray(schema.firings.id, rows.map(r => r.firingId)))
    if (firings.some(f => f.firedBy === user.id) || rows.some(r => r.createdBy === user.id)) {
      throw createError({ statusCode: 403, message: 'You fired or entered runs of this series: another supervisor must accept it (separation of duties).' })
    }
    const earlier = await tx.select({ resultIds: schema.energyEquivalents.resultIds, acceptedAt: schema.energyEquivalents.acceptedAt }).from(schema.energyEquivalents).where(eq(schema.energyEquivalents.vesselId, id))
    const reused = rows.filter(r => earlier.some(e => (e.resultIds as string[]).includes(r.id)))
    if (reused.length) throw createError({ statusCode: 409, message: `Already part of an accepted series: ${reused.map(r => r.sampleCode).join(', ')}. A series is made of new standardisation runs.` })
    const values = rows.map(r => (r.values as ResultValues).energyEquivalentJPerK!)
    const stats = seriesStatistics(values, seriesPolicy(policy))
    if (!stats.accepted) throw createError({ statusCode: 409, message: `The series cannot be accepted: ${stats.reason}`, data: { statistics: stats } })
    await tx.update(schema.energyEquivalents).set({ active: false }).where(and(eq(schema.energyEquivalents.vesselId, id), eq(schema.energyEquivalents.active, true)))
    const [row] = await tx.insert(schema.energyEquivalents).values({
      vesselId: id, valueJPerK: stats.mean!, standardDeviationJPerK: stats.standardDeviation!, relativeStandardDeviationPct: stats.relativeStandardDeviationPct!,
      runs: stats.n, resultIds: input.resultIds, meanEnergyJ: mean(rows.map(r => (r.values as ResultValues).energyReleasedJ ?? 0)), acceptedBy: user.id, active: true,
    }).returning()
    const [sig] = await tx.insert(schema.signatures).values({
      entity: 'energy-equivalent', entityId: row!.id, signerId: user.id, signerName: user.name, meaning: 'standardisation series accepted', reason: input.reason, boundHash: seriesHash(rows),
    }).returning()
    await audit(tx, event, {
      action: 'energy-equivalent.accept', entity: 'vessel', entityId: id,
      newValues: { energyEquivalentId: row!.id, vessel: vessel.name, valueJPerK: stats.mean, standardDeviationJPerK: stats.standardDeviation, relativeStandardDeviationPct: stats.relativeStandardDeviationPct, runs: stats.n, resultIds: input.resultIds, signatureId: sig!.id },
      reason: input.reason,
    })
    return { energyEquivalent: energyEquivalentView(row!, user.name), statistics: stats }
  })
  await renewSession(event)
  setResponseStatus(event, 201)
  return accepted
})
