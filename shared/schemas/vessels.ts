import { z } from 'zod'

export const VESSEL_CLASSES = ['standard', 'high-strength'] as const
export type VesselClass = typeof VESSEL_CLASSES[number]

// Plausible bounds for a laboratory combustion vessel (common practice); they catch typing slips, not ratings.
const pos = (max: number, what: string) => z.number({ error: `${what} must be a number` }).positive(`${what} must be above 0`).max(max, `${what} must be at most ${max}`)
const count = (max: number, what: string) => z.number({ error: `${what} must be a number` }).int(`${what} must be a whole number`).min(1, `${what} must be at least 1`).max(max)

export const proofChargeSchema = z.object({
  massG: pos(20, 'proof charge mass'),
  heatingValueJPerG: pos(100_000, 'proof charge heating value'),
  fillPressureMPa: pos(20, 'proof charge fill pressure'),
}).strict()

const ratings = {
  class: z.enum(VESSEL_CLASSES),
  ratedEnergyJ: pos(500_000, 'rated energy'),
  maxChargeMassG: pos(20, 'maximum charge mass'),
  maxFillPressureMPa: pos(20, 'maximum fill pressure'),
  volumeMl: z.number().min(50, 'volume must be at least 50 mL').max(5000, 'volume must be at most 5000 mL'),
  proofCharge: proofChargeSchema,
  serviceIntervalFirings: count(100_000, 'service interval'),
  serviceIntervalDays: count(3650, 'service interval'),
  requalificationIntervalFirings: count(1_000_000, 'requalification interval'),
  // Marked by the vessel's maker or the lab as resistant to halogen acids (chlorine-rich samples).
  halogenResistant: z.boolean({ error: 'halogen-resistant must be true or false' }),
}

export const RATING_FIELDS = Object.keys(ratings) as (keyof typeof ratings)[]

const text = (max: number) => z.string().trim().max(max)

export const vesselCreateSchema = z.object({
  name: text(80).min(1, 'required'),
  serialNumber: text(80).min(1, 'required'),
  ...ratings,
  proofCharge: proofChargeSchema.optional(),
  serviceIntervalFirings: ratings.serviceIntervalFirings.optional(),
  serviceIntervalDays: ratings.serviceIntervalDays.optional(),
  requalificationIntervalFirings: ratings.requalificationIntervalFirings.optional(),
  halogenResistant: ratings.halogenResistant.default(false),
  location: text(120).default(''),
  notes: text(2000).default(''),
  // A vessel brought in from elsewhere keeps its history: the admin records where it stands.
  initialCondition: z.enum(['normal', 'away', 'awaiting-verification', 'retired']).default('normal'),
  initialFiringsSinceService: z.number().int().min(0).max(1_000_000).default(0),
  initialFiringsSinceRequalification: z.number().int().min(0).max(1_000_000).default(0),
  initialFiringsTotal: z.number().int().min(0).max(10_000_000).default(0),
  lastServicedAt: z.iso.datetime({ offset: true }).optional(),
}).strict().refine(v => v.initialFiringsTotal >= v.initialFiringsSinceRequalification && v.initialFiringsSinceRequalification >= v.initialFiringsSinceService, {
  message: 'lifetime ≥ since requalification ≥ since service',
  path: ['initialFiringsTotal'],
})

export const vesselPatchSchema = z.object({
  name: text(80).min(1, 'required').optional(),
  serialNumber: text(80).min(1, 'required').optional(),
  class: ratings.class.optional(),
  ratedEnergyJ: ratings.ratedEnergyJ.optional(),
  maxChargeMassG: ratings.maxChargeMassG.optional(),
  maxFillPressureMPa: ratings.maxFillPressureMPa.optional(),
  volumeMl: ratings.volumeMl.optional(),
  proofCharge: proofChargeSchema.optional(),
  serviceIntervalFirings: ratings.serviceIntervalFirings.optional(),
  serviceIntervalDays: ratings.serviceIntervalDays.optional(),
  requalificationIntervalFirings: ratings.requalificationIntervalFirings.optional(),
  halogenResistant: ratings.halogenResistant.optional(),
  location: text(120).optional(),
  notes: text(2000).optional(),
  reason: text(1000).optional(),
}).strict()

export type VesselCreate = z.infer<typeof vesselCreateSchema>
export type VesselPatch = z.infer<typeof vesselPatchSchema>
