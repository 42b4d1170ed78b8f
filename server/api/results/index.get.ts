import { desc } from 'drizzle-orm'

// Results, newest first (current revisions unless asked otherwise), with the duplicate agreement of each sample code.
export default defineEventHandler(async (event) => {
  await requireRole(event)
  const q = parseQuery(event, resultListQuery)
  const db = useDb()
  const rows = await db.select().from(schema.results).where(resultListWhere(q)).orderBy(desc(schema.results.createdAt)).limit(q.limit)
  const policy = await getPolicy()
  const [views, duplicates] = await Promise.all([
    loadResultViews(db, rows),
    duplicateSummaries(db, rows.filter(x => x.kind === 'sample').map(x => x.sampleCode), policy),
  ])
  return { rows: views, duplicates }
})
