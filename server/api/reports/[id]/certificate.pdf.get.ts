import { eq } from 'drizzle-orm'


// The certificate as a PDF attachment, rendered from the content frozen when the report number was issued.
export default defineEventHandler(async (event) => {
  await requireRole(event)
  const { id } = parseParams(event, idParam)
  const [row] = await useDb().select().from(schema.reports).where(eq(schema.reports.id, id))
  if (!row) throw createError({ statusCode: 404, message: 'No such report.' })
  const pdf = await renderCertificatePdf(row.content, { reportNumber: row.reportNumber, issuedAt: row.issuedAt })
  const safeCode = row.sampleCode.replace(/[^\w.-]+/g, '_').slice(0, 60)
  setResponseHeaders(event, {
    'Content-Type': 'application/pdf',
    'Content-Disposition': `attachment; filename="certificate-${row.reportNumber}-${safeCode}.pdf"`,
    'Cache-Control': 'no-store',
  })
  return pdf
})
