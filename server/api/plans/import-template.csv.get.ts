import { IMPORT_TEMPLATE } from '#shared/plan-import'

export default defineEventHandler(async (event) => {
  await requireRole(event)
  setResponseHeader(event, 'Content-Type', 'text/csv; charset=utf-8')
  setResponseHeader(event, 'Content-Disposition', 'attachment; filename="emberline-batch-template.csv"')
  return IMPORT_TEMPLATE
})
