import { check, date, doublePrecision, index, integer, jsonb, pgSequence, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core'
import { sql } from 'drizzle-orm'
import { SAMPLE_STATUSES } from '../../../shared/schemas/samples'
import type { StoredDayPlan } from '../../../shared/types/stored'
import { createdAt, id, oneOf, updatedAt } from './columns'
import { users } from './people'
import { materials } from './runs'

// ─── Clients, sample receipt and day plans ───────────────────────────────────────────────────
export const clients = pgTable('clients', {
  id: id(),
  name: text('name').notNull().unique(),
  contactName: text('contact_name'),
  contactEmail: text('contact_email'),
  address: text('address'),
  createdBy: uuid('created_by').notNull().references(() => users.id),
  createdAt: createdAt(),
  updatedAt: updatedAt(),
})

// Lab codes number from a sequence: a number once drawn is never drawn again, even when its receipt fails or is rejected.
export const sampleLabCodeSeq = pgSequence('sample_lab_code_seq', { startWith: 1 })

export const samples = pgTable('samples', {
  id: id(),
  labCode: text('lab_code').notNull().unique(),
  clientId: uuid('client_id').notNull().references(() => clients.id),
  clientReference: text('client_reference'),
  description: text('description').notNull(),
  materialId: uuid('material_id').references(() => materials.id),
  receivedAt: timestamp('received_at', { withTimezone: true }).notNull(),
  condition: text('condition'),
  receivedMassG: doublePrecision('received_mass_g'),
  note: text('note').notNull().default(''),
  status: text('status', { enum: SAMPLE_STATUSES }).notNull().default('received'),
  rejectionReason: text('rejection_reason'),
  // How many determinations the analyst planned for it (null until planned). A repeat of a failed firing adds a run,
  // not a determination, so the sample's bench state counts against this number, not against its runs.
  determinations: integer('determinations'),
  receivedBy: uuid('received_by').notNull().references(() => users.id),
  createdAt: createdAt(),
  updatedAt: updatedAt(),
}, t => [
  index('samples_status_idx').on(t.status, t.receivedAt),
  index('samples_client_idx').on(t.clientId),
  oneOf('samples_status_check', t.status, SAMPLE_STATUSES),
  check('samples_determinations_check', sql`${t.determinations} is null or ${t.determinations} between 1 and 10`),
])

// An accepted day plan: which runs each vessel fires on a day, in which order, and why.
export const dayPlans = pgTable('day_plans', {
  id: id(),
  day: date('day').notNull(),
  vesselIds: jsonb('vessel_ids').notNull().$type<string[]>(),
  proposal: jsonb('proposal').notNull().$type<StoredDayPlan>(),
  acceptedBy: uuid('accepted_by').notNull().references(() => users.id),
  acceptedAt: timestamp('accepted_at', { withTimezone: true }).notNull().defaultNow(),
}, t => [index('day_plans_day_idx').on(t.day)])
