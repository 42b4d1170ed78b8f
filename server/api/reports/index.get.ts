import { desc, eq } from 'drizzle-orm'
import { z } from 'zod'

const query = z.object({ sampleCode: z.preprocess(v => (v === '' ? undefined : v), z.string().trim().max(80).optional()) })

// Issued certificates, newest first, optionally for one sample.
export default defineEventHandler(async (event) => {
  await requireRole(event)
  const { sampleCode } = parseQuery(event, query)
  const r = schema.reports
  const rows = await useDb().select({ id: r.id, reportNumber: r.reportNumber, sampleCode: r.sampleCode, issuedAt: r.issuedAt, resultIds: r.resultIds, issuedByName: schema.users.name })
    .from(r).innerJoin(schema.users, eq(schema.users.id, r.issuedBy))
    .where(sampleCode ? eq(r.sampleCode, sampleCode) : undefined).orderBy(desc(r.issuedAt)).limit(500)
  return rows.map(x => ({ ...x, resultIds: x.resultIds, download: `/api/reports/${x.id}/certificate.pdf` }))
})
