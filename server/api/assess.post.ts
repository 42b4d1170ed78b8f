import { z } from 'zod'
import {
  assessCharge,
  ChargeInputError,
  chargeInputSchema,
  type ChargeComponentInput,
  type InputIssue,
  resolveComponents,
  type ResolvedComponent,
  vesselInputSchema,
} from '#shared/domain/assessment'

// The vessel comes from the register (vesselId, with its current state) or inline; one of them is needed.
// A sample without a mass is assessed at the suggested mass; an aid or a fuse without its amount cannot be assessed.
const assessBodySchema = chargeInputSchema
  .extend({
    vesselId: z.string().uuid('a vessel id (UUID)').optional(),
    vessel: vesselInputSchema.optional(),
  })
  .superRefine((body, ctx) => {
    if (!body.vesselId && !body.vessel) {
      ctx.addIssue({ code: 'custom', path: ['vesselId'], message: 'give a vesselId from the register or an inline vessel with its ratings' })
    }
    body.components.forEach((c, i) => {
      const missing = (field: 'massG' | 'lengthCm', message: string) => ctx.addIssue({ code: 'custom', path: ['components', i, field], message })
      if (c.role === 'aid' && c.massG === undefined) missing('massG', 'a combustion aid needs its mass in g')
      if (c.role !== 'fuse') return
      if (c.wire === 'cotton') {
        if (c.massG === undefined) missing('massG', 'a cotton thread needs its mass in g')
      }
      else if (c.wire !== undefined) {
        if (c.lengthCm === undefined) missing('lengthCm', `a ${c.wire} fuse wire needs its burnt length in cm`)
      }
      else if (c.lengthCm === undefined && c.massG === undefined) {
        missing('lengthCm', 'a fuse needs a wire length in cm (or, for cotton, a mass in g)')
      }
    })
  })

const fieldsOf = (issues: readonly InputIssue[]) => issues.map(i => ({ path: i.path.map(String).join('.'), message: i.message }))

/**
 * Resolves each component on its own so that every failing formula or structure is named by its index; a library
 * error other than the domain's own still names the field, because it comes from the text the caller sent.
 */
async function resolveEach(components: ChargeComponentInput[]): Promise<ResolvedComponent[]> {
  const issues: InputIssue[] = []
  const out = await Promise.all(components.map(async (component, index) => {
    try {
      const [resolved] = await resolveComponents([component])
      return resolved ?? component
    }
    catch (error) {
      if (error instanceof ChargeInputError) {
        issues.push(...error.issues.map(i => ({ path: ['components', index, ...i.path.slice(2)], message: i.message })))
      }
      else {
        console.error('[assess] structure or formula library failed:', error)
        issues.push({ path: ['components', index, component.smiles ? 'smiles' : 'formula'], message: 'cannot be read' })
      }
      return component
    }
  }))
  if (issues.length > 0) invalidInput(fieldsOf(issues))
  return out
}

// Stateless assessment of one charge for any signed-in role, by the same shared code the Quick check page runs.
export default defineEventHandler(async (event) => {
  await requireUser(event)
  const body = await parseBody(event, assessBodySchema)
  const { vesselId, vessel: inlineVessel, ...charge } = body

  const [policy, row, components] = await Promise.all([getPolicy(), vesselId ? findVesselOr404(useDb(), vesselId) : null, resolveEach(charge.components)])
  // The register's record wins over an inline vessel: its state (overdue, locked out…) must not be bypassed.
  const vessel = row ? assessmentVessel(vesselView(row, policy)) : inlineVessel!

  try {
    // standardEnergyJ: the caller's own target until standardisation records exist.
    return assessCharge({ ...charge, vessel, components }, policy)
  }
  catch (error) {
    if (error instanceof ChargeInputError) invalidInput(fieldsOf(error.issues))
    throw error
  }
})
