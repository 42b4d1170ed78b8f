import { z } from 'zod'
import { AID_KINDS } from '../domain/results/aid-values'

// A supervisor accepts the lab's own series of determinations of an aid's heating value, signing with the password.
export const acceptAidValueSchema = z.object({
  kind: z.enum(AID_KINDS, { error: 'capsule, tape, oil, cotton or other' }),
  materialId: z.string().uuid('a material id (UUID)').optional(),
  lot: z.string().trim().max(120).default(''),
  determinationsJPerG: z.array(z.number({ error: 'a heating value in J/g' }).positive('above 0 J/g').max(150_000, 'at most 150,000 J/g'))
    .min(2, 'at least two determinations').max(30, 'at most 30 determinations'),
  note: z.string().trim().max(2000).default(''),
  password: z.string().min(1, 'your password signs this').max(1024),
  reason: z.string().trim().min(3, 'say why').max(2000),
}).strict().refine(v => v.kind === 'cotton' || v.materialId !== undefined, { path: ['materialId'], message: 'the aid material whose lot was determined' })
