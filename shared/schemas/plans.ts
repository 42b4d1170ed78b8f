import { z } from 'zod'
import { chemicalText } from '../domain/assessment/schema'
import { COMPOSITION_BASES } from '../domain/composition'
import { DECLARED_HAZARDS } from '../domain/screening'

export const RUN_KINDS = ['sample', 'standardisation', 'check'] as const
export const RUN_STATUSES = ['draft', 'ready', 'awaiting-approval', 'blocked', 'rejected', 'fired', 'withdrawn'] as const
export type RunStatus = typeof RUN_STATUSES[number]

const pct = z.number().min(0).max(100)

// A run's component: the /api/assess component, optionally naming a material whose values fill in the rest.
export const runComponentSchema = z.object({
  role: z.enum(['sample', 'aid', 'fuse']),
  materialId: z.string().uuid('a material id (UUID)').optional(),
  massG: z.number().min(0).max(1000).optional(),
  lengthCm: z.number().min(0).max(1000).optional(),
  wire: z.enum(['nichrome', 'iron', 'platinum', 'cotton']).optional(),
  heatingValueJPerG: z.number().positive().max(200_000).optional(),
  formula: chemicalText('formula', 200).optional(),
  smiles: chemicalText('structure', 2000).optional(),
  composition: z.object({
    C: pct.optional(), H: pct.optional(), N: pct.optional(), S: pct.optional(), O: pct.optional(), Cl: pct.optional(), ash: pct.optional(), moisture: pct.optional(),
    basis: z.enum(COMPOSITION_BASES).optional(),
  }).strict().optional(),
  declaredHazard: z.enum(DECLARED_HAZARDS).optional(),
  decompositionEnergyJPerG: z.number().min(0).max(100_000).optional(),
  category: z.string().trim().max(40).optional(),
  boilingPointC: z.number().min(-273).max(2000).optional(),
  vapourPressureKPa: z.number().min(0).max(100_000).optional(),
  chlorinePct: z.number().min(0).max(100).optional(),
  containment: z.enum(['capsule', 'tape']).optional(),
  name: z.string().trim().max(200).optional(),
}).strict()
export type RunComponent = z.infer<typeof runComponentSchema>

export const planCreateSchema = z.object({
  name: z.string().trim().min(1, 'required').max(160),
  vesselId: z.string().uuid('choose a vessel'),
  fillPressureMPa: z.number().positive('above 0').max(20),
  note: z.string().trim().max(2000).default(''),
}).strict()

export const runInputSchema = z.object({
  sampleCode: z.string().trim().min(1, 'required').max(80),
  kind: z.enum(RUN_KINDS).default('sample'),
  vesselId: z.string().uuid('a vessel id (UUID)').optional(),
  fillPressureMPa: z.number().positive('above 0').max(20).optional(),
  components: z.array(runComponentSchema).min(1, 'at least one component').max(12),
  note: z.string().trim().max(2000).default(''),
}).strict()
export type RunInput = z.infer<typeof runInputSchema>

// A change to a run: every field optional and none defaulted, so that what is left out stays as it was.
export const runPatchSchema = runInputSchema.extend({
  kind: z.enum(RUN_KINDS).optional(),
  note: z.string().trim().max(2000).optional(),
}).partial()

export const signatureSchema = z.object({
  password: z.string().min(1, 'your password signs this').max(1024),
  reason: z.string().trim().min(3, 'say why').max(2000),
  // The charge the signer saw; a different current charge means the request changed and must be asked again.
  chargeHash: z.string().max(128).optional(),
}).strict()
