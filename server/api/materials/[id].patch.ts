import { eq } from 'drizzle-orm'
import { materialPatchSchema } from '#shared/schemas/materials'

// Edits keep the record's id (plans that used it keep their stored assessment); every edit is audited with its reason.
export default defineEventHandler(async (event) => {
  await requireRole(event, 'supervisor')
  const { id } = parseParams(event, materialIdParam)
  const { reason, ...input } = await parseBody(event, materialPatchSchema)
  await checkMaterialChemistry(input)
  const row = await useDb().transaction(async (tx) => {
    const before = await findMaterialOr404(tx, id)
    const [updated] = await tx.update(schema.materials).set({ ...input, updatedAt: new Date() }).where(eq(schema.materials.id, id)).returning()
    await audit(tx, event, { action: input.active === false ? 'material.retire' : 'material.update', entity: 'material', entityId: id, oldValues: before, newValues: updated, reason })
    return updated!
  })
  return { ...materialView(row), derived: await materialDerived(row, await getPolicy()) }
})
