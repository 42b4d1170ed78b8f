import { z } from 'zod'

const uuid = z.string().uuid('an id (UUID)')
export const dayPlanRequestSchema = z.object({
  day: z.iso.date('a day (YYYY-MM-DD)'),
  vesselIds: z.array(uuid).min(1, 'choose at least one vessel').max(100).refine(ids => new Set(ids).size === ids.length, 'a vessel is named twice'),
  // Vessel id → run ids in firing order; absent for a fresh proposal.
  assignment: z.record(uuid, z.array(uuid).max(200)).optional(),
}).strict()
export type DayPlanRequest = z.infer<typeof dayPlanRequestSchema>

export const dayPlanAcceptSchema = dayPlanRequestSchema.extend({
  assignment: z.record(uuid, z.array(uuid).max(200)),
}).strict()
