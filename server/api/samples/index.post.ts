import { eq } from 'drizzle-orm'
import { sampleReceiptSchema } from '#shared/schemas/samples'

// Receipt of a sample (analysts and supervisors log what arrives): the lab code is drawn in the same transaction.
export default defineEventHandler(async (event) => {
  const user = await requireRole(event)
  const input = await parseBody(event, sampleReceiptSchema)
  const receivedAt = new Date(input.receivedAt)
  if (receivedAt.getTime() > Date.now() + 5 * 60_000) invalidInput([{ path: 'receivedAt', message: 'not in the future' }])
  const { labName } = await getLabSettings()
  const row = await useDb().transaction(async (tx) => {
    const issues: { path: string, message: string }[] = []
    const [client] = await tx.select({ id: schema.clients.id }).from(schema.clients).where(eq(schema.clients.id, input.clientId))
    if (!client) issues.push({ path: 'clientId', message: 'no such client' })
    if (input.materialId) {
      const [m] = await tx.select({ id: schema.materials.id }).from(schema.materials).where(eq(schema.materials.id, input.materialId))
      if (!m) issues.push({ path: 'materialId', message: 'no such material' })
    }
    if (issues.length) invalidInput(issues)
    const labCode = await nextLabCode(tx, labName, receivedAt)
    const [created] = await tx.insert(schema.samples).values({ ...input, receivedAt, labCode, status: 'received', receivedBy: user.id }).returning()
    await audit(tx, event, { action: 'sample.receive', entity: 'sample', entityId: created!.id, newValues: created })
    return created!
  })
  setResponseStatus(event, 201)
  return sampleView(row)
})
