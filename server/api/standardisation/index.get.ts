import { asc, eq } from 'drizzle-orm'

// Standardisation at a glance: each vessel with its accepted ε and the standardisation runs not yet in an accepted series.
export default defineEventHandler(async (event) => {
  await requireRole(event)
  const db = useDb()
  const policy = await getPolicy()
  const [vessels, energies, results] = await Promise.all([
    db.select().from(schema.vessels).orderBy(asc(schema.vessels.name)),
    db.select().from(schema.energyEquivalents),
    db.select({ id: schema.results.id, vesselId: schema.results.vesselId, kind: schema.results.kind }).from(schema.results)
      .where(eq(schema.results.current, true)),
  ])
  const accepted = new Set(energies.flatMap(e => e.resultIds))
  return vessels.filter(v => v.condition !== 'retired').map((v) => {
    const active = energies.filter(e => e.vesselId === v.id && e.active).sort((a, b) => b.acceptedAt.getTime() - a.acceptedAt.getTime())[0]
    return {
      vessel: vesselView(v, policy),
      active: active ? energyEquivalentView(active) : null,
      pendingStandardisations: results.filter(r => r.vesselId === v.id && r.kind === 'standardisation' && !accepted.has(r.id)).length,
      checks: results.filter(r => r.vesselId === v.id && r.kind === 'check').length,
    }
  })
})
