import { eq } from 'drizzle-orm'
import { DEFAULT_POLICY, labPolicySchema } from '#shared/domain/policy'
import type { LabPolicy } from '#shared/domain/policy'

export interface LabSettings { labName: string, policy: LabPolicy, updatedAt: Date | null }

/** The lab's policy in force: the stored values over the defaults in shared/domain/policy.ts (read fresh: several instances may serve). */
export async function getLabSettings(): Promise<LabSettings> {
  const [row] = await useDb().select().from(schema.labSettings).where(eq(schema.labSettings.id, 1))
  const merged = labPolicySchema.safeParse({ ...DEFAULT_POLICY, ...(row?.policy as object | null) })
  if (!merged.success) console.error('[policy] stored policy is invalid; the defaults are in force:', merged.error.message)
  return {
    labName: row?.labName ?? 'Emberline laboratory',
    policy: merged.success ? merged.data : DEFAULT_POLICY,
    updatedAt: row?.updatedAt ?? null,
  }
}

export async function getPolicy(): Promise<LabPolicy> {
  return (await getLabSettings()).policy
}
