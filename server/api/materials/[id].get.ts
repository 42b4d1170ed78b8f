export default defineEventHandler(async (event) => {
  await requireUser(event)
  const { id } = parseParams(event, materialIdParam)
  const [m, policy] = await Promise.all([findMaterialOr404(useDb(), id), getPolicy()])
  return { ...materialView(m), derived: await materialDerived(m, policy) }
})
