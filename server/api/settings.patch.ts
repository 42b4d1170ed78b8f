import { z } from 'zod'
import { labPolicySchema } from '#shared/domain/policy'

const body = z.object({
  labName: z.string().trim().min(1).max(160).optional(),
  // Validated whole, after merging over the policy in force (the schema checks fields against each other).
  policy: z.record(z.string(), z.unknown()).optional(),
  reason: z.string().trim().min(3, 'say why the policy changes').max(1000),
}).strict()

// Policy is owned by the supervisor and administered by the admin; every change is audited with its reason.
export default defineEventHandler(async (event) => {
  const user = await requireRole(event, 'admin', 'supervisor')
  const input = await parseBody(event, body)
  const before = await getLabSettings()
  const policy = { ...before.policy, ...input.policy }
  const merged = labPolicySchema.safeParse(policy)
  if (!merged.success) invalidInput(merged.error.issues.map(i => ({ path: `policy.${i.path.join('.')}`, message: i.message })))
  await useDb().transaction(async (tx) => {
    await tx.insert(schema.labSettings)
      .values({ id: 1, labName: input.labName ?? before.labName, policy, updatedBy: user.id })
      .onConflictDoUpdate({ target: schema.labSettings.id, set: { labName: input.labName ?? before.labName, policy, updatedBy: user.id, updatedAt: new Date() } })
    await audit(tx, event, {
      action: 'settings.update',
      entity: 'lab-settings',
      entityId: '1',
      oldValues: { labName: before.labName, policy: before.policy },
      newValues: { labName: input.labName ?? before.labName, policy },
      reason: input.reason,
    })
  })
  return await getLabSettings()
})
