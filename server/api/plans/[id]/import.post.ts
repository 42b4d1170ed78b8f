import { eq } from 'drizzle-orm'
import { z } from 'zod'
import { parsePlanImport } from '#shared/plan-import'

const body = z.object({
  csv: z.string().min(1, 'the file is empty').max(1_000_000, 'at most 1 MB'),
  commit: z.boolean().default(false),
}).strict()

// Preview (commit=false) shows each row's verdict and errors; commit saves every row in one transaction or none.
export default defineEventHandler(async (event) => {
  const user = await requireRole(event)
  const { id } = parseParams(event, idParam)
  const { csv, commit } = await parseBody(event, body)
  const db = useDb()
  const plan = await findPlanOr404(db, id)
  const [materialRefs, vesselRows, policy] = await Promise.all([
    db.select({ id: schema.materials.id, name: schema.materials.name }).from(schema.materials).where(eq(schema.materials.active, true)),
    db.select().from(schema.vessels),
    getPolicy(),
  ])
  const { rows, fileErrors } = parsePlanImport(csv, materialRefs, vesselRows)
  // Refused before each row is assessed: the file would take the plan past the policy's ceiling.
  await assertPlanRoom(db, id, rows.length, policy, 'csv')
  const vesselsByName = new Map(vesselRows.map(v => [v.name, vesselView(v, policy)]))
  const planVessel = vesselView(vesselRows.find(v => v.id === plan.vesselId)!, policy)

  const previews = await Promise.all(rows.map(async (r) => {
    if (!r.input) return { line: r.line, sampleCode: r.sampleCode, errors: r.errors, verdict: null, findings: [] }
    const vessel = r.input.vesselName ? vesselsByName.get(r.input.vesselName)! : planVessel
    try {
      await refuseCheckRunWithoutEnergyEquivalent(db, r.input.kind, vessel)
      const { assessment } = await assessRun(db, { vessel, fillPressureMPa: r.input.fillPressureMPa ?? plan.fillPressureMPa, components: r.input.components, kind: r.input.kind }, policy)
      return { line: r.line, sampleCode: r.sampleCode, errors: [], verdict: assessment.verdict, heatReleaseJ: assessment.heatReleaseJ, vesselName: vessel.name, findings: assessment.findings.filter(f => f.severity !== 'info').map(f => ({ code: f.code, severity: f.severity, message: f.message })) }
    }
    catch (err) {
      const e = err as { data?: { fields?: { path: string, message: string }[] }, message?: string }
      return { line: r.line, sampleCode: r.sampleCode, errors: e.data?.fields?.map(f => `${f.path}: ${f.message}`) ?? [e.message ?? 'cannot be assessed'], verdict: null, findings: [] }
    }
  }))
  const ok = !fileErrors.length && previews.every(p => !p.errors.length)
  if (!commit || !ok) {
    if (commit) setResponseStatus(event, 422)
    return { ok, committed: false as const, fileErrors, rows: previews }
  }

  const created = await db.transaction(async (tx) => {
    await findPlanOr404(tx, id, true)
    await assertPlanRoom(tx, id, rows.length, policy, 'csv')
    const values: NewRun[] = []
    for (const r of rows) {
      const input = r.input!
      const vessel = input.vesselName ? vesselsByName.get(input.vesselName)! : planVessel
      const fillPressureMPa = input.fillPressureMPa ?? plan.fillPressureMPa
      const { assessment, chargeHash } = await assessRun(tx, { vessel, fillPressureMPa, components: input.components, kind: input.kind }, policy)
      values.push({
        sampleCode: input.sampleCode, kind: input.kind, vesselId: vessel.id, fillPressureMPa,
        components: input.components, assessment, verdict: assessment.verdict, chargeHash, status: 'draft', note: input.note, plannedBy: user.id,
      })
    }
    const ids = (await insertNumberedRuns(tx, id, values)).map(r => r.id)
    await audit(tx, event, { action: 'plan.import', entity: 'plan', entityId: id, newValues: { runs: ids.length, runIds: ids } })
    return ids
  })
  return { ok: true, committed: true as const, created: created.length, fileErrors: [], rows: previews }
})
