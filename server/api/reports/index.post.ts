import { z } from 'zod'

const body = z.object({ sampleCode: z.string().trim().min(1, 'required').max(80) }).strict()

// Issue a certificate of analysis for a sample (supervisor): a new, never reused report number and the content frozen with it.
export default defineEventHandler(async (event) => {
  const user = await requireRole(event)
  const { sampleCode } = await parseBody(event, body)
  const report = await useDb().transaction(async (tx) => {
    const results = await certificateContent(tx, sampleCode, user)
    const resultIds = results.resultIds
    // Not issued while any item the standard asks for is missing (client, receipt, item, dates, method, results, uncertainty, agreement, signatory).
    const { sampleId, receipt } = await certificateReceipt(tx, sampleCode)
    const missing = missingCertificateItems(results.content, receipt)
    if (missing.length) throw createError({ statusCode: 422, message: `The certificate cannot be issued yet; missing: ${missing.join('; ')}.`, data: { missing } })
    const content = withReceiptItems(results.content, receipt!)
    const [row] = await tx.insert(schema.reports).values({ sampleCode, resultIds, content, issuedBy: user.id }).returning()
    await audit(tx, event, {
      action: 'report.issue', entity: 'report', entityId: row!.id,
      newValues: { reportNumber: row!.reportNumber, sampleCode, resultIds, replaces: content.replaces, rows: content.rows },
    })
    if (sampleId) await reportSample(tx, event, sampleId, row!.reportNumber)
    return row!
  })
  setResponseStatus(event, 201)
  return { id: report.id, reportNumber: report.reportNumber, sampleCode: report.sampleCode, issuedAt: report.issuedAt, resultIds: report.resultIds, download: `/api/reports/${report.id}/certificate.pdf` }
})
