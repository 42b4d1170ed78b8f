import { sql } from 'drizzle-orm'
import { boolean, doublePrecision, index, integer, jsonb, pgTable, text, timestamp, uniqueIndex, uuid } from 'drizzle-orm/pg-core'
import type { AnyPgColumn } from 'drizzle-orm/pg-core'
import { type Assessment, VERDICTS } from '../../../shared/domain/assessment/contract'
import { COMPOSITION_BASES } from '../../../shared/domain/composition'
import { DECLARED_HAZARDS } from '../../../shared/domain/screening'
import { MATERIAL_CATEGORIES } from '../../../shared/schemas/materials'
import { RUN_KINDS, RUN_STATUSES, type RunComponent } from '../../../shared/schemas/plans'
import { SIGNATURE_ENTITIES, SIGNATURE_MEANINGS } from '../../../shared/states'
import type { StoredComposition, TypicalRange } from '../../../shared/types/stored'
import { createdAt, id, oneOf, updatedAt } from './columns'
import { users } from './people'
import { dayPlans, samples } from './samples'
import { vessels } from './vessels'

// ─── Materials library ───────────────────────────────────────────────────────────────────────
export const materials = pgTable('materials', {
  id: id(),
  name: text('name').notNull(),
  category: text('category', { enum: MATERIAL_CATEGORIES }).notNull(),
  heatingValueJPerG: doublePrecision('heating_value_j_per_g'),
  heatingValueUncertaintyJPerG: doublePrecision('heating_value_uncertainty_j_per_g'),
  heatingValueSource: text('heating_value_source'),
  typicalRange: jsonb('typical_range').$type<TypicalRange>(), // for typical-value entries
  composition: jsonb('composition').$type<StoredComposition>(), // mass-% on compositionBasis
  compositionBasis: text('composition_basis', { enum: COMPOSITION_BASES }),
  formula: text('formula'),
  smiles: text('smiles'),
  declaredHazard: text('declared_hazard', { enum: DECLARED_HAZARDS }).notNull().default('none'),
  decompositionEnergyJPerG: doublePrecision('decomposition_energy_j_per_g'),
  // Evidence behind the decomposition energy (the only route by which it clears a screen): onset, method, document.
  decompositionOnsetC: doublePrecision('decomposition_onset_c'),
  decompositionMethod: text('decomposition_method'),
  decompositionEvidence: text('decomposition_evidence'), // attachment id or document reference
  decompositionRecordedBy: uuid('decomposition_recorded_by').references(() => users.id),
  decompositionRecordedAt: timestamp('decomposition_recorded_at', { withTimezone: true }),
  // Who recorded the structure or classification (identity) of the material, and when.
  identityRecordedBy: uuid('identity_recorded_by').references(() => users.id),
  identityRecordedAt: timestamp('identity_recorded_at', { withTimezone: true }),
  boilingPointC: doublePrecision('boiling_point_c'),
  vapourPressureKPa: doublePrecision('vapour_pressure_kpa'),
  chlorinePct: doublePrecision('chlorine_pct'),
  notes: text('notes').notNull().default(''),
  reference: boolean('reference').notNull().default(false),
  active: boolean('active').notNull().default(true),
  createdBy: uuid('created_by').references(() => users.id),
  createdAt: createdAt(),
  updatedAt: updatedAt(),
}, t => [
  index('materials_name_idx').on(t.name),
  index('materials_category_idx').on(t.category),
  // The library page's order (reference standards first, then by name) among active materials: a page of 50 reads 50
  // index entries instead of sorting the whole library (docs/benchmarks.md).
  index('materials_list_idx').on(t.reference, t.name).where(sql`${t.active}`),
  oneOf('materials_category_check', t.category, MATERIAL_CATEGORIES),
  oneOf('materials_composition_basis_check', t.compositionBasis, COMPOSITION_BASES),
  oneOf('materials_declared_hazard_check', t.declaredHazard, DECLARED_HAZARDS),
])

// ─── Plans and runs ──────────────────────────────────────────────────────────────────────────
export const plans = pgTable('plans', {
  id: id(),
  name: text('name').notNull(),
  vesselId: uuid('vessel_id').notNull().references(() => vessels.id),
  fillPressureMPa: doublePrecision('fill_pressure_mpa').notNull(),
  note: text('note').notNull().default(''),
  createdBy: uuid('created_by').notNull().references(() => users.id),
  submittedAt: timestamp('submitted_at', { withTimezone: true }),
  createdAt: createdAt(),
  updatedAt: updatedAt(),
}, t => [index('plans_created_idx').on(t.createdAt)])

export const runs = pgTable('runs', {
  id: id(),
  planId: uuid('plan_id').notNull().references(() => plans.id),
  seq: integer('seq').notNull(),
  sampleCode: text('sample_code').notNull(),
  kind: text('kind', { enum: RUN_KINDS }).notNull().default('sample'),
  vesselId: uuid('vessel_id').notNull().references(() => vessels.id),
  fillPressureMPa: doublePrecision('fill_pressure_mpa').notNull(),
  components: jsonb('components').notNull().$type<RunComponent[]>(),
  assessment: jsonb('assessment').notNull().$type<Assessment>(),
  verdict: text('verdict', { enum: VERDICTS }).notNull(),
  // Hash of the charge and its assessment; a signature is bound to it.
  chargeHash: text('charge_hash').notNull(),
  status: text('status', { enum: RUN_STATUSES }).notNull().default('draft'),
  note: text('note').notNull().default(''),
  plannedBy: uuid('planned_by').notNull().references(() => users.id),
  // The received sample this run tests (null for runs planned from a typed code, and for standardisation runs).
  sampleId: uuid('sample_id').references((): AnyPgColumn => samples.id),
  // The accepted day plan that placed this run on its vessel, and its place in that vessel's order.
  dayPlanId: uuid('day_plan_id').references((): AnyPgColumn => dayPlans.id),
  dayOrder: integer('day_order'),
  // Everyone who changed the charge after planning it, and everyone who submitted it: none of them may sign it.
  editedBy: uuid('edited_by').array().notNull().default(sql`'{}'::uuid[]`),
  submittedBy: uuid('submitted_by').array().notNull().default(sql`'{}'::uuid[]`),
  // Why the run is in its status when the system put it there (e.g. sent back for a new signature at the firing).
  statusReason: text('status_reason'),
  createdAt: createdAt(),
  updatedAt: updatedAt(),
}, t => [
  // A run's number in its plan is unique: concurrent insertions cannot share one.
  uniqueIndex('runs_plan_seq_unique').on(t.planId, t.seq),
  index('runs_sample_idx').on(t.sampleId),
  index('runs_status_idx').on(t.status),
  index('runs_vessel_idx').on(t.vesselId),
  // The plans list counts each plan's runs by status (an index-only scan; docs/benchmarks.md).
  index('runs_plan_status_idx').on(t.planId, t.status),
  oneOf('runs_kind_check', t.kind, RUN_KINDS),
  oneOf('runs_status_check', t.status, RUN_STATUSES),
  oneOf('runs_verdict_check', t.verdict, VERDICTS),
])

const MEANINGS = Object.values(SIGNATURE_MEANINGS) as [typeof SIGNATURE_MEANINGS[keyof typeof SIGNATURE_MEANINGS], ...typeof SIGNATURE_MEANINGS[keyof typeof SIGNATURE_MEANINGS][]]

// Electronic signatures on runs (approvals, rejections), results (sign-off) and accepted series.
export const signatures = pgTable('signatures', {
  id: id(),
  entity: text('entity', { enum: SIGNATURE_ENTITIES }).notNull(),
  entityId: uuid('entity_id').notNull(),
  signerId: uuid('signer_id').notNull().references(() => users.id),
  signerName: text('signer_name').notNull(),
  meaning: text('meaning', { enum: MEANINGS }).notNull(),
  reason: text('reason').notNull(),
  boundHash: text('bound_hash').notNull(),
  signedAt: timestamp('signed_at', { withTimezone: true }).notNull().defaultNow(),
}, t => [
  index('signatures_entity_idx').on(t.entity, t.entityId),
  oneOf('signatures_entity_check', t.entity, SIGNATURE_ENTITIES),
  oneOf('signatures_meaning_check', t.meaning, MEANINGS),
])
