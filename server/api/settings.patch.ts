import { eq } from 'drizzle-orm'
import { z } from 'zod'
import { DEFAULT_POLICY, labPolicySchema } from '#shared/domain/policy'

const body = z.object({
  labName: z.string().trim().min(1).max(160).optional(),
  // Validated whole, after merging over the policy in force (the schema checks fields against each other).
  policy: z.record(z.string(), z.unknown()).optional(),
  reason: z.string().trim().min(3, 'say why the policy changes').max(1000),
}).strict()

// The policy is owned by the supervisor and administered by the admin; every change is audited with its reason.
export default defineEventHandler(async (event) => {
  const user = await requireRole(event)
  const input = await parseBody(event, body)
  await useDb().transaction(async (tx) => {
    // Read and merge under the row lock: two changes at once both land, neither overwrites the other.
    await tx.insert(schema.labSettings).values({ id: 1, labName: 'Emberline laboratory', policy: {} }).onConflictDoNothing()
    const [row] = await tx.select().from(schema.labSettings).where(eq(schema.labSettings.id, 1)).for('update')
    const stored = (row?.policy ?? {}) as Record<string, unknown>
    const before = labPolicySchema.safeParse({ ...DEFAULT_POLICY, ...stored })
    const beforePolicy = before.success ? before.data : DEFAULT_POLICY
    const policy = { ...beforePolicy, ...input.policy }
    const merged = labPolicySchema.safeParse(policy)
    if (!merged.success) invalidInput(merged.error.issues.map(i => ({ path: `policy.${i.path.join('.')}`, message: i.message })))
    const labName = input.labName ?? row?.labName ?? 'Emberline laboratory'
    await tx.update(schema.labSettings).set({ labName, policy, updatedBy: user.id, updatedAt: new Date() }).where(eq(schema.labSettings.id, 1))
    await audit(tx, event, {
      action: 'settings.update',
      entity: 'lab-settings',
      entityId: '1',
      oldValues: { labName: row?.labName, policy: beforePolicy },
      newValues: { labName, policy },
      reason: input.reason,
    })
    await announcePolicyChange(tx)
  })
  forgetLabSettings()
  return await getLabSettings()
})
