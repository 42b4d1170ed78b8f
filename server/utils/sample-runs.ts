// A received sample as a planned charge: its material (when known), the suggested mass for the target energy, a fuse.
import type { LabPolicy } from '#shared/domain/policy'
import type { RunComponent } from '#shared/schemas/plans'

/** Fuse of a routine charge: 10 cm of nickel-chromium wire (common practice; the analyst edits it on the plan). */
export const ROUTINE_FUSE: RunComponent = { role: 'fuse', wire: 'nichrome', lengthCm: 10 }
/** Mass used only to ask the assessment for its suggestion (1 g, common practice for a first charge). */
const PROBE_MASS_G = 1

/**
 * Assesses the sample once at 1 g to learn the mass that releases the lab's target energy within the approval limits
 * (the assessment's own suggestion), then assesses the charge at that mass; without a suggestion the largest
 * unblocked mass, else 1 g, and the stored assessment says why.
 */
export async function suggestedRun(db: Db | Tx, sample: SampleRow, vessel: VesselView, fillPressureMPa: number, policy: LabPolicy) {
  const burns: RunComponent = { role: 'sample', ...(sample.materialId ? { materialId: sample.materialId } : { name: sample.description.slice(0, 200) }) }
  return suggestedCharge(db, burns, 'sample', vessel, fillPressureMPa, policy)
}

/** The charge of `burns` (without its mass) and a routine fuse at the mass the assessment suggests for the target energy. */
export async function suggestedCharge(db: Db | Tx, burns: RunComponent, kind: string, vessel: VesselView, fillPressureMPa: number, policy: LabPolicy) {
  const charge = (massG: number): RunComponent[] => [{ ...burns, massG }, ROUTINE_FUSE]
  const probe = await assessRun(db, { vessel, fillPressureMPa, components: charge(PROBE_MASS_G), kind }, policy)
  const s = probe.assessment.suggestions
  const massG = s.targetSampleMassG ?? s.maxSampleMassG ?? PROBE_MASS_G
  if (massG === PROBE_MASS_G) return { components: charge(massG), ...probe }
  const components = charge(massG)
  return { components, ...await assessRun(db, { vessel, fillPressureMPa, components, kind }, policy) }
}
