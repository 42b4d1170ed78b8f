import { boolean, check, date, doublePrecision, index, integer, jsonb, pgTable, primaryKey, text, timestamp, uniqueIndex, uuid } from 'drizzle-orm/pg-core'
import { sql } from 'drizzle-orm'
import type { AnyPgColumn } from 'drizzle-orm/pg-core'
import { VESSEL_CONDITIONS, VESSEL_STATES } from '../../../shared/domain/vessel-state'
import { FIRING_OUTCOMES } from '../../../shared/domain/vessel-lifecycle'
import { SERVICE_KINDS } from '../../../shared/schemas/services'
import { VESSEL_CLASSES } from '../../../shared/schemas/vessels'
import type { StoredFiringData, StoredServiceRecord } from '../../../shared/types/stored'
import type { FiringAnswer } from '../../utils/firing'
import { createdAt, id, oneOf, updatedAt } from './columns'
import { users } from './people'
import { runs } from './runs'
import { samples } from './samples'

// ─── Vessels ───────────────────────────────────────────────────────────────────
// Counters live on the vessel row and are incremented by the database in the firing's transaction.
export const vessels = pgTable('vessels', {
  id: id(),
  name: text('name').notNull().unique(),
  serialNumber: text('serial_number').notNull().unique(),
  class: text('class', { enum: VESSEL_CLASSES }).notNull(),
  ratedEnergyJ: doublePrecision('rated_energy_j').notNull(),
  maxChargeMassG: doublePrecision('max_charge_mass_g').notNull(),
  maxFillPressureMPa: doublePrecision('max_fill_pressure_mpa').notNull(),
  volumeMl: doublePrecision('volume_ml').notNull(),
  // Marked resistant to halogen acids: chlorine-rich samples may be fired in it without an exception.
  halogenResistant: boolean('halogen_resistant').notNull().default(false),
  proofChargeMassG: doublePrecision('proof_charge_mass_g').notNull(),
  proofChargeHeatingValueJPerG: doublePrecision('proof_charge_heating_value_j_per_g').notNull(),
  proofChargeFillPressureMPa: doublePrecision('proof_charge_fill_pressure_mpa').notNull(),
  serviceIntervalFirings: integer('service_interval_firings').notNull(),
  serviceIntervalDays: integer('service_interval_days').notNull(),
  requalificationIntervalFirings: integer('requalification_interval_firings').notNull(),
  location: text('location').notNull().default(''),
  notes: text('notes').notNull().default(''),
  // 'normal' | 'locked-out' | 'away' | 'awaiting-verification' | 'retired'; the state is computed from it and the counters.
  condition: text('condition', { enum: VESSEL_CONDITIONS }).notNull().default('normal'),
  conditionReason: text('condition_reason'),
  conditionSince: timestamp('condition_since', { withTimezone: true }),
  firingsSinceService: integer('firings_since_service').notNull().default(0),
  firingsSinceRequalification: integer('firings_since_requalification').notNull().default(0),
  firingsTotal: integer('firings_total').notNull().default(0),
  // Lifetime firings the vessel had when registered (before Emberline): reconciliation counts from here.
  firingsTotalAtRegistration: integer('firings_total_at_registration').notNull().default(0),
  lastServicedAt: timestamp('last_serviced_at', { withTimezone: true }),
  lastRequalifiedAt: timestamp('last_requalified_at', { withTimezone: true }),
  // Last state for which a reminder went out (so each transition is mailed once).
  notifiedState: text('notified_state', { enum: VESSEL_STATES }),
  registeredAt: timestamp('registered_at', { withTimezone: true }).notNull().defaultNow(),
  createdAt: createdAt(),
  updatedAt: updatedAt(),
}, t => [
  oneOf('vessels_class_check', t.class, VESSEL_CLASSES),
  oneOf('vessels_condition_check', t.condition, VESSEL_CONDITIONS),
  oneOf('vessels_notified_state_check', t.notifiedState, VESSEL_STATES),
])

// ─── Firings ─────────────────────────────────────────────────────────────────────────────────
export const firings = pgTable('firings', {
  id: id(),
  runId: uuid('run_id').notNull().unique().references(() => runs.id),
  vesselId: uuid('vessel_id').notNull().references(() => vessels.id),
  // Unique per user (index below): one person's key never collides with, or reveals, another's.
  idempotencyKey: text('idempotency_key').notNull(),
  outcome: text('outcome', { enum: FIRING_OUTCOMES }).notNull(),
  weighedMassG: doublePrecision('weighed_mass_g').notNull(),
  data: jsonb('data').notNull().$type<StoredFiringData>(),
  answer: jsonb('answer').notNull().$type<FiringAnswer>(),
  firedBy: uuid('fired_by').notNull().references(() => users.id),
  firedAt: timestamp('fired_at', { withTimezone: true }).notNull().defaultNow(),
}, t => [
  index('firings_vessel_idx').on(t.vesselId, t.firedAt),
  uniqueIndex('firings_user_idempotency_key_idx').on(t.firedBy, t.idempotencyKey),
  oneOf('firings_outcome_check', t.outcome, FIRING_OUTCOMES),
])

// Firings per vessel and UTC day, kept by triggers on firings (migration 0008) in the same statement as the firing, so
// a firing rate over weeks reads a few dozen rows instead of every firing. Never written by the app itself.
export const vesselFiringDays = pgTable('vessel_firing_days', {
  vesselId: uuid('vessel_id').notNull().references(() => vessels.id),
  day: date('day', { mode: 'string' }).notNull(),
  firings: integer('firings').notNull(),
}, t => [
  primaryKey({ columns: [t.vesselId, t.day] }),
  check('vessel_firing_days_firings_check', sql`${t.firings} >= 0`),
])

// ─── Vessel servicing ────────────────────────────────────────────────────────────────────────
export const services = pgTable('services', {
  id: id(),
  vesselId: uuid('vessel_id').notNull().references(() => vessels.id),
  kind: text('kind', { enum: SERVICE_KINDS }).notNull(),
  record: jsonb('record').notNull().$type<StoredServiceRecord>(),
  performedAt: timestamp('performed_at', { withTimezone: true }).notNull(),
  signedBy: uuid('signed_by').notNull().references(() => users.id),
  signerName: text('signer_name').notNull(),
  correctsId: uuid('corrects_id'),
  createdAt: createdAt(),
}, t => [
  index('services_vessel_idx').on(t.vesselId, t.performedAt),
  oneOf('services_kind_check', t.kind, SERVICE_KINDS),
])

export const attachments = pgTable('attachments', {
  id: id(),
  serviceId: uuid('service_id').references(() => services.id),
  // A photo taken at a sample's receipt (stored already linked, so never an orphan).
  sampleId: uuid('sample_id').references((): AnyPgColumn => samples.id),
  storageKey: text('storage_key').notNull().unique(),
  fileName: text('file_name').notNull(),
  contentType: text('content_type').notNull(),
  sizeBytes: integer('size_bytes').notNull(),
  uploadedBy: uuid('uploaded_by').notNull().references(() => users.id),
  createdAt: createdAt(),
})
