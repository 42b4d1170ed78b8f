import { z } from 'zod'

const body = z.object({ sampleCode: z.string().trim().min(1, 'required').max(80) }).strict()

// Issue a certificate of analysis for a sample (supervisor): a new, never reused report number and the content frozen with it.
export default defineEventHandler(async (event) => {
  const user = await requireRole(event, 'supervisor')
  const { sampleCode } = await parseBody(event, body)
  const report = await useDb().transaction(async (tx) => {
    const { content, resultIds } = await certificateContent(tx, sampleCode, user)
    const [row] = await tx.insert(schema.reports).values({ sampleCode, resultIds, content, issuedBy: user.id }).returning()
    await audit(tx, event, {
      action: 'report.issue', entity: 'report', entityId: row!.id,
      newValues: { reportNumber: row!.reportNumber, sampleCode, resultIds, replaces: content.replaces, rows: content.rows },
    })
    return row!
  })
  setResponseStatus(event, 201)
  return { id: report.id, reportNumber: report.reportNumber, sampleCode: report.sampleCode, issuedAt: report.issuedAt, resultIds: report.resultIds as string[], download: `/api/reports/${report.id}/certificate.pdf` }
})
