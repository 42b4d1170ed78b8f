import { boolean, doublePrecision, index, integer, jsonb, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core'
import { AID_KINDS } from '../../../shared/domain/results/aid-values'
import type { ResultValues } from '../../../shared/domain/results/result-types'
import type { ResultInputs } from '../../../shared/schemas/results'
import { RUN_KINDS } from '../../../shared/schemas/plans'
import { RESULT_STATUSES } from '../../../shared/states'
import type { CertificateContent } from '../../utils/certificate'
import { createdAt, id, oneOf } from './columns'
import { materials, runs } from './runs'
import { users } from './people'
import { firings, vessels } from './vessels'

// ─── Results: one row per revision; a signed result changes only through a new revision ──
export const results = pgTable('results', {
  id: id(),
  runId: uuid('run_id').notNull().references(() => runs.id),
  firingId: uuid('firing_id').notNull().references(() => firings.id),
  vesselId: uuid('vessel_id').notNull().references(() => vessels.id),
  sampleCode: text('sample_code').notNull(),
  kind: text('kind', { enum: RUN_KINDS }).notNull(),
  revision: integer('revision').notNull().default(1),
  supersedesId: uuid('supersedes_id'),
  current: boolean('current').notNull().default(true),
  inputs: jsonb('inputs').notNull().$type<ResultInputs>(),
  values: jsonb('values').notNull().$type<ResultValues>(),
  energyEquivalentId: uuid('energy_equivalent_id'),
  status: text('status', { enum: RESULT_STATUSES }).notNull().default('unsigned'),
  signatureId: uuid('signature_id'),
  reason: text('reason'),
  createdBy: uuid('created_by').notNull().references(() => users.id),
  createdAt: createdAt(),
}, t => [
  index('results_sample_idx').on(t.sampleCode, t.current),
  index('results_vessel_idx').on(t.vesselId, t.kind, t.createdAt),
  index('results_run_idx').on(t.runId),
  oneOf('results_kind_check', t.kind, RUN_KINDS),
  oneOf('results_status_check', t.status, RESULT_STATUSES),
])

// The accepted energy equivalent of the calorimeter with a vessel, from a standardisation series.
export const energyEquivalents = pgTable('energy_equivalents', {
  id: id(),
  vesselId: uuid('vessel_id').notNull().references(() => vessels.id),
  valueJPerK: doublePrecision('value_j_per_k').notNull(),
  standardDeviationJPerK: doublePrecision('standard_deviation_j_per_k').notNull(),
  relativeStandardDeviationPct: doublePrecision('relative_standard_deviation_pct').notNull(),
  runs: integer('runs').notNull(),
  resultIds: jsonb('result_ids').notNull().$type<string[]>(),
  meanEnergyJ: doublePrecision('mean_energy_j'),
  acceptedBy: uuid('accepted_by').notNull().references(() => users.id),
  acceptedAt: timestamp('accepted_at', { withTimezone: true }).notNull().defaultNow(),
  active: boolean('active').notNull().default(true),
}, t => [index('energy_equivalents_vessel_idx').on(t.vesselId, t.acceptedAt)])

// Heating values of combustion aids and the cotton fuse as the lab determined them: a small series accepted by signature.
export const aidValues = pgTable('aid_values', {
  id: id(),
  kind: text('kind', { enum: AID_KINDS }).notNull(),
  materialId: uuid('material_id').references(() => materials.id),
  lot: text('lot').notNull().default(''),
  determinationsJPerG: jsonb('determinations_j_per_g').notNull().$type<number[]>(),
  runs: integer('runs').notNull(),
  meanJPerG: doublePrecision('mean_j_per_g').notNull(),
  standardDeviationJPerG: doublePrecision('standard_deviation_j_per_g').notNull(),
  standardUncertaintyJPerG: doublePrecision('standard_uncertainty_j_per_g').notNull(),
  note: text('note').notNull().default(''),
  acceptedBy: uuid('accepted_by').notNull().references(() => users.id),
  signatureId: uuid('signature_id'),
  acceptedAt: timestamp('accepted_at', { withTimezone: true }).notNull().defaultNow(),
  active: boolean('active').notNull().default(true),
}, t => [
  index('aid_values_material_idx').on(t.materialId, t.active), index('aid_values_kind_idx').on(t.kind, t.active),
  oneOf('aid_values_kind_check', t.kind, AID_KINDS),
])

// Certificates of analysis: a unique, never reused report number per issued certificate.
export const reports = pgTable('reports', {
  id: id(),
  reportNumber: integer('report_number').generatedAlwaysAsIdentity({ startWith: 1001 }).unique(),
  sampleCode: text('sample_code').notNull(),
  resultIds: jsonb('result_ids').notNull().$type<string[]>(),
  content: jsonb('content').notNull().$type<CertificateContent>(),
  issuedBy: uuid('issued_by').notNull().references(() => users.id),
  issuedAt: timestamp('issued_at', { withTimezone: true }).notNull().defaultNow(),
})
