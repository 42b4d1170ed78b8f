import { SIGNATURE_MEANINGS } from '#shared/states'
import { and, eq, inArray } from 'drizzle-orm'
import { mean, seriesStatistics } from '#shared/domain/results'
import { dutyConflict } from '#shared/domain/run-lifecycle'

// A supervisor accepts a standardisation series (signed): its mean ε becomes the vessel's active energy equivalent.
export default defineEventHandler(async (event) => {
  const user = await requireRole(event)
  const { id } = parseParams(event, vesselIdParam)
  const input = await parseBody(event, acceptSeriesSchema)
  const db = useDb()
  await findVesselOr404(db, id)
  const policy = await getPolicy()
  const accepted = await signWithPassword(event, user, { entity: 'vessel', entityId: id, password: input.password }, signer => db.transaction(async (tx) => {
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
    const conflict = dutyConflict(user.id, 'runs of this series', { fired: firings.map(f => f.firedBy), entered: rows.map(r => r.createdBy) })
    if (conflict) throw new Refusal('forbidden', conflict, { reason: 'separation-of-duties' })
    const earlier = await tx.select({ resultIds: schema.energyEquivalents.resultIds, acceptedAt: schema.energyEquivalents.acceptedAt }).from(schema.energyEquivalents).where(eq(schema.energyEquivalents.vesselId, id))
    const reused = rows.filter(r => earlier.some(e => e.resultIds.includes(r.id)))
    if (reused.length) throw new Refusal('conflict', `Already part of an accepted series: ${reused.map(r => r.sampleCode).join(', ')}. A series is made of new standardisation runs.`)
    const values = rows.map(r => r.values.energyEquivalentJPerK!)
    const stats = seriesStatistics(values, seriesPolicy(policy))
    if (!stats.accepted) throw new Refusal('conflict', `The series cannot be accepted: ${stats.reason}`, { statistics: stats })
    await tx.update(schema.energyEquivalents).set({ active: false }).where(and(eq(schema.energyEquivalents.vesselId, id), eq(schema.energyEquivalents.active, true)))
    const [row] = await tx.insert(schema.energyEquivalents).values({
      vesselId: id, valueJPerK: stats.mean!, standardDeviationJPerK: stats.standardDeviation!, relativeStandardDeviationPct: stats.relativeStandardDeviationPct!,
      runs: stats.n, resultIds: input.resultIds, meanEnergyJ: mean(rows.map(r => r.values.energyReleasedJ ?? 0)), acceptedBy: user.id, active: true,
    }).returning()
    const sig = await signer.sign(tx, { entity: 'energy-equivalent', entityId: row!.id, meaning: SIGNATURE_MEANINGS.standardisation, reason: input.reason, boundHash: seriesHash(rows) })
    await audit(tx, signer, {
      action: 'energy-equivalent.accept', entity: 'vessel', entityId: id,
      newValues: { energyEquivalentId: row!.id, vessel: vessel.name, valueJPerK: stats.mean, standardDeviationJPerK: stats.standardDeviation, relativeStandardDeviationPct: stats.relativeStandardDeviationPct, runs: stats.n, resultIds: input.resultIds, signatureId: sig.id },
      reason: input.reason,
    })
    return { energyEquivalent: energyEquivalentView(row!, user.name), statistics: stats }
  }))
  setResponseStatus(event, 201)
  return accepted
})
