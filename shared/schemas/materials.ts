import { z } from 'zod'
import { compositionProblems } from '../domain/composition'
import { chemicalText } from '../domain/assessment/schema'
import { COMPOSITION_BASES, type CompositionBasis } from '../domain/composition'
import { DECLARED_HAZARDS } from '../domain/screening'

export const MATERIAL_CATEGORIES = [
  'coal', 'coke', 'biomass', 'liquid fuel', 'waste fuel', 'food', 'feed', 'polymer', 'reference standard', 'combustion aid', 'chemical', 'other',
] as const
export type MaterialCategory = typeof MATERIAL_CATEGORIES[number]

const pct = z.number().min(0).max(100)
export const materialCompositionSchema = z.object({
  C: pct.optional(), H: pct.optional(), N: pct.optional(), S: pct.optional(), O: pct.optional(), Cl: pct.optional(), ash: pct.optional(), moisture: pct.optional(),
}).strict()

/** The composition's parts must not add up past 100 % on its basis (moisture apart on the dry basis). */
function checkComposition(v: { composition?: Record<string, number | undefined> | null, compositionBasis?: string | null }, ctx: z.RefinementCtx) {
  if (!v.composition) return
  for (const message of compositionProblems({ ...v.composition, basis: (v.compositionBasis ?? 'dry') as CompositionBasis })) {
    ctx.addIssue({ code: 'custom', path: ['composition'], message })
  }
}

const fields = {
  name: z.string().trim().min(1, 'required').max(160),
  category: z.enum(MATERIAL_CATEGORIES),
  heatingValueJPerG: z.number().positive().max(200_000).nullable().optional(),
  heatingValueUncertaintyJPerG: z.number().min(0).max(50_000).nullable().optional(),
  heatingValueSource: z.string().trim().max(500).nullable().optional(),
  typicalRange: z.object({ minJPerG: z.number().positive().max(200_000), maxJPerG: z.number().positive().max(200_000), note: z.string().max(300).optional() }).strict()
    .refine(r => r.minJPerG <= r.maxJPerG, { message: 'minimum above maximum' }).nullable().optional(),
  composition: materialCompositionSchema.nullable().optional(),
  compositionBasis: z.enum(COMPOSITION_BASES).nullable().optional(),
  formula: chemicalText('formula', 200).nullable().optional(),
  smiles: chemicalText('structure', 2000).nullable().optional(),
  declaredHazard: z.enum(DECLARED_HAZARDS).default('none'),
  decompositionEnergyJPerG: z.number().min(0).max(100_000).nullable().optional(),
  decompositionOnsetC: z.number().min(-50).max(1500).nullable().optional(),
  decompositionMethod: z.string().trim().min(3).max(300).nullable().optional(),
  decompositionEvidence: z.string().trim().min(3).max(300).nullable().optional(),
  boilingPointC: z.number().min(-273).max(2000).nullable().optional(),
  vapourPressureKPa: z.number().min(0).max(100_000).nullable().optional(),
  chlorinePct: z.number().min(0).max(100).nullable().optional(),
  notes: z.string().trim().max(4000).default(''),
}

/** A decomposition energy is kept only with its onset temperature, method and evidence document (it may clear a screen). */
function checkDecomposition(v: { decompositionEnergyJPerG?: number | null, decompositionOnsetC?: number | null, decompositionMethod?: string | null, decompositionEvidence?: string | null }, ctx: z.RefinementCtx) {
  if (v.decompositionEnergyJPerG === undefined || v.decompositionEnergyJPerG === null) return
  const need = { decompositionOnsetC: 'the onset temperature (°C) of the measurement', decompositionMethod: 'the method (e.g. DSC, heating rate, crucible)', decompositionEvidence: 'the evidence document (attachment id or report reference)' } as const
  for (const [field, what] of Object.entries(need)) {
    const value = v[field as keyof typeof need]
    if (value === undefined || value === null) ctx.addIssue({ code: 'custom', path: [field], message: `a decomposition energy needs ${what}` })
  }
}

export const materialCreateSchema = z.object(fields).strict().superRefine(checkComposition).superRefine(checkDecomposition)

export const materialPatchSchema = z.object({
  ...Object.fromEntries(Object.entries(fields).map(([k, v]) => [k, (v as z.ZodType).optional()])) as { [K in keyof typeof fields]: z.ZodOptional<typeof fields[K]> },
  active: z.boolean().optional(),
  reason: z.string().trim().min(3, 'say why the material record changes').max(1000),
}).strict().superRefine(checkComposition).superRefine(checkDecomposition)

export type MaterialCreate = z.infer<typeof materialCreateSchema>
