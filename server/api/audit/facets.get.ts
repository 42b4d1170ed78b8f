import { asc } from 'drizzle-orm'

// The entities and actions present in the trail, for the filter bar's choices.
export default defineEventHandler(async (event) => {
  await requireRole(event)
  const db = useDb()
  const a = schema.auditLog
  const [entities, actions] = await Promise.all([
    db.selectDistinct({ v: a.entity }).from(a).orderBy(asc(a.entity)),
    db.selectDistinct({ v: a.action }).from(a).orderBy(asc(a.action)),
  ])
  return { entities: entities.map(r => r.v), actions: actions.map(r => r.v) }
})
