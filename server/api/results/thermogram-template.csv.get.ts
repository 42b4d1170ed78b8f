import { readFile } from 'node:fs/promises'
import { join } from 'node:path'

// The thermogram template of the README (data/thermogram-template.csv, read from the folder the server starts in).
export default defineEventHandler(async (event) => {
  await requireRole(event)
  let text: string
  try {
    text = await readFile(join(process.cwd(), 'data', 'thermogram-template.csv'), 'utf8')
  }
  catch {
    throw createError({ statusCode: 404, message: 'The thermogram template (data/thermogram-template.csv) is not installed with this server.' })
  }
  setResponseHeaders(event, {
    'Content-Type': 'text/csv; charset=utf-8',
    'Content-Disposition': 'attachment; filename="thermogram-template.csv"',
  })
  return text
})
