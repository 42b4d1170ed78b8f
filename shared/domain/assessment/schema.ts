// The zod schema of a charge as POST /api/assess and the run routes receive it.
import { z } from 'zod'
import { COMPOSITION_BASES, compositionProblems } from '../composition'
import { DECLARED_HAZARDS } from '../screening'
import { chemicalTextProblem, normaliseChemicalText } from '../hygiene'

/**
 * A formula or SMILES field: NFKC-normalised, then refused (422) when any character is outside printable ASCII,
 * naming the character and its position; never silently dropped.
 */
export function chemicalText(what: 'formula' | 'structure', max: number) {
  return z.string().superRefine((text, ctx) => {
    const problem = chemicalTextProblem(text, what)
    if (problem) ctx.addIssue({ code: 'custom', message: problem.message, params: { character: problem.character, position: problem.position } })
  }).transform(text => normaliseChemicalText(text).trim()).pipe(z.string().min(1).max(max))
}

const compositionSchema = z
  .object({
    C: z.number().min(0).max(100).optional(),
    H: z.number().min(0).max(100).optional(),
    N: z.number().min(0).max(100).optional(),
    S: z.number().min(0).max(100).optional(),
    O: z.number().min(0).max(100).optional(),
    Cl: z.number().min(0).max(100).optional(),
    ash: z.number().min(0).max(100).optional(),
    moisture: z.number().min(0).max(100).optional(),
    basis: z.enum(COMPOSITION_BASES).optional(),
  })
  .refine(c => compositionProblems(c).length === 0, { message: 'The composition parts add up to more than 100 %' })

const componentSchema = z.object({
  role: z.enum(['sample', 'aid', 'fuse']),
  massG: z.number().min(0).max(1000).optional(),
  lengthCm: z.number().min(0).max(1000).optional(),
  wire: z.enum(['nichrome', 'iron', 'platinum', 'cotton']).optional(),
  heatingValueJPerG: z.number().min(0).max(200000).optional(),
  formula: chemicalText('formula', 200).optional(),
  smiles: chemicalText('structure', 2000).optional(),
  composition: compositionSchema.optional(),
  declaredHazard: z.enum(DECLARED_HAZARDS).optional(),
  decompositionEnergyJPerG: z.number().min(0).max(100000).optional(),
  category: z.string().trim().max(40).optional(),
  boilingPointC: z.number().min(-273).max(2000).optional(),
  vapourPressureKPa: z.number().min(0).max(100000).optional(),
  chlorinePct: z.number().min(0).max(100).optional(),
  containment: z.enum(['capsule', 'tape']).optional(),
  name: z.string().max(200).optional(),
  densityGPerMl: z.number().min(0.05).max(25).optional(),
  heatingValueFrom: z.enum(['declared', 'material']).optional(),
})

const proofChargeSchema = z.object({
  massG: z.number().positive().max(100),
  heatingValueJPerG: z.number().positive().max(200000),
  fillPressureMPa: z.number().positive().max(50),
})

export const vesselInputSchema = z.object({
  ratedEnergyJ: z.number().positive().max(1e7),
  maxChargeMassG: z.number().positive().max(1000),
  maxFillPressureMPa: z.number().positive().max(50),
  volumeMl: z.number().positive().max(100000),
  class: z.enum(['standard', 'high-strength']),
  state: z
    .enum(['in-service', 'service-due', 'overdue', 'requalification-due', 'locked-out', 'away', 'awaiting-verification', 'retired'])
    .optional(),
  name: z.string().max(200).optional(),
  proofCharge: proofChargeSchema.optional(),
  halogenResistant: z.boolean().optional(),
})

/**
 * Request body of POST /api/assess without vesselId, which the route resolves. Unknown keys such as
 * `resolved` are stripped, so a caller cannot supply its own screening result: run resolveComponents after parsing.
 */
export const chargeInputSchema = z.object({
  vessel: vesselInputSchema,
  fillPressureMPa: z.number().min(0).max(50),
  temperatureC: z.number().min(-20).max(60).optional(),
  waterMl: z.number().min(0).max(100).optional(),
  components: z.array(componentSchema).min(1).max(20),
  standardEnergyJ: z.number().positive().max(1e7).optional(),
  runRole: z.enum(['sample', 'standardisation', 'check']).optional(),
})
