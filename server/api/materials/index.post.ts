import { materialCreateSchema } from '#shared/schemas/materials'

// The supervisor owns the materials library.
export default defineEventHandler(async (event) => {
  const user = await requireRole(event)
  const input = await parseBody(event, materialCreateSchema)
  await checkMaterialChemistry(input)
  const row = await useDb().transaction(async (tx) => {
    const [created] = await tx.insert(schema.materials).values({ ...input, ...materialRecordedBy(input, user.id), createdBy: user.id }).returning()
    await audit(tx, event, { action: 'material.create', entity: 'material', entityId: created!.id, newValues: created })
    return created!
  })
  setResponseStatus(event, 201)
  return { ...materialView(row), derived: await materialDerived(row, await getPolicy()) }
})
