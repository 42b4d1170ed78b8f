import { inArray } from 'drizzle-orm'

export default defineEventHandler(async (event) => {
  await requireUser(event)
  const { id } = parseParams(event, materialIdParam)
  const db = useDb()
  const [m, policy] = await Promise.all([findMaterialOr404(db, id), getPolicy()])
  // Names of the supervisors who vouched for the record, for the page.
  const ids = [m.identityRecordedBy, m.decompositionRecordedBy].filter((x): x is string => !!x)
  const people = ids.length ? await db.select({ id: schema.users.id, name: schema.users.name }).from(schema.users).where(inArray(schema.users.id, ids)) : []
  const nameOf = (userId: string | null) => people.find(p => p.id === userId)?.name ?? null
  return {
    ...materialView(m),
    identityRecordedByName: nameOf(m.identityRecordedBy),
    decompositionRecordedByName: nameOf(m.decompositionRecordedBy),
    derived: await materialDerived(m, policy),
  }
})
