import { desc } from 'drizzle-orm'

// The results list as a spreadsheet-safe CSV (same filters as GET /api/results), values in J/g as computed; the
// columns and their units are in server/utils/results-csv.ts.
export default defineEventHandler(async (event) => {
  await requireRole(event)
  const q = parseQuery(event, resultListQuery)
  const db = useDb()
  const rows = await db.select().from(schema.results).where(resultListWhere(q)).orderBy(desc(schema.results.createdAt)).limit(q.limit)
  const views = await loadResultViews(db, rows)
  const duplicates = await duplicateSummaries(db, rows.filter(x => x.kind === 'sample').map(x => x.sampleCode), await getPolicy())
  setCsvDownload(event, 'results')
  return csvHeader(RESULT_CSV_COLUMNS.map(([header]) => header))
    + csvLines(views.map(v => RESULT_CSV_COLUMNS.map(([, value]) => value(v, duplicates[v.sampleCode]))))
})
