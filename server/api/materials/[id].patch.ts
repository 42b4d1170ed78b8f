import { eq } from 'drizzle-orm'
import { materialPatchSchema } from '#shared/schemas/materials'

// Edits keep the record's id (plans that used it keep their stored assessment); every edit is audited with its reason.
export default defineEventHandler(async (event) => {
  const user = await requireRole(event)
  const { id } = parseParams(event, materialIdParam)
  const { reason, ...input } = await parseBody(event, materialPatchSchema)
  await checkMaterialChemistry(input)
  const row = await useDb().transaction(async (tx) => {
    const before = await findMaterialOr404(tx, id)
    // A patch of a decomposition energy alone keeps the evidence already on record, and is checked against it.
    if (input.decompositionEnergyJPerG != null) {
      const merged = { ...before, ...input }
      const missing = (['decompositionOnsetC', 'decompositionMethod', 'decompositionEvidence'] as const).filter(f => merged[f] === null || merged[f] === undefined)
      if (missing.length) invalidInput(missing.map(f => ({ path: f, message: 'a decomposition energy needs its onset temperature, method and evidence document' })))
    }
    const [updated] = await tx.update(schema.materials).set({ ...input, ...materialRecordedBy(input, user.id), updatedAt: new Date() }).where(eq(schema.materials.id, id)).returning()
    await audit(tx, event, { action: input.active === false ? 'material.retire' : 'material.update', entity: 'material', entityId: id, oldValues: before, newValues: updated, reason })
    return updated!
  })
  return { ...materialView(row), derived: await materialDerived(row, await getPolicy()) }
})
