import { sql } from 'drizzle-orm'
import { boolean, index, integer, jsonb, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core'
import type { LabPolicy } from '../../../shared/domain/policy'
import { MAIL_STATUSES, PASSWORD_CHECK_PURPOSES, SESSION_END_REASONS } from '../../../shared/states'
import type { AuditValues } from '../../../shared/types/stored'
import { ROLE_NAMES } from '../../../shared/types/roles'
import { allOf, createdAt, id, oneOf, updatedAt } from './columns'

export const ROLES = ROLE_NAMES

export const users = pgTable('users', {
  id: id(),
  email: text('email').notNull().unique(),
  name: text('name').notNull(),
  passwordHash: text('password_hash').notNull(),
  roles: text('roles').array().notNull().default(sql`'{}'::text[]`),
  active: boolean('active').notNull().default(true),
  // Raised to end every session the user holds (disable, password reset, "sign out everywhere").
  sessionEpoch: integer('session_epoch').notNull().default(0),
  lastSignInAt: timestamp('last_sign_in_at', { withTimezone: true }),
  createdAt: createdAt(),
  updatedAt: updatedAt(),
}, t => [allOf('users_roles_check', t.roles, ROLE_NAMES)])

// One row per lab: the policy values with their defaults, edited by an admin.
export const labSettings = pgTable('lab_settings', {
  id: integer('id').primaryKey().default(1),
  labName: text('lab_name').notNull(),
  // Only the values the admin changed; the rest come from the defaults when read.
  policy: jsonb('policy').notNull().$type<Partial<LabPolicy>>(),
  updatedAt: updatedAt(),
  updatedBy: uuid('updated_by').references(() => users.id),
})

// Append-only: a trigger in the migrations refuses UPDATE, DELETE and TRUNCATE.
export const auditLog = pgTable('audit_log', {
  id: id(),
  at: timestamp('at', { withTimezone: true }).notNull().defaultNow(),
  actorId: uuid('actor_id').references(() => users.id),
  actorName: text('actor_name'),
  action: text('action').notNull(),
  entity: text('entity').notNull(),
  entityId: text('entity_id'),
  oldValues: jsonb('old_values').$type<AuditValues>(),
  newValues: jsonb('new_values').$type<AuditValues>(),
  reason: text('reason'),
  requestId: text('request_id'),
}, t => [
  index('audit_log_at_idx').on(t.at),
  index('audit_log_entity_idx').on(t.entity, t.entityId, t.at),
  index('audit_log_actor_idx').on(t.actorId, t.at),
])

// Password checks (sign-in and signatures), kept in the database so throttling holds across several app instances.
// A row is written before the hash is verified (success null while it runs), so concurrent attempts count at once.
export const loginAttempts = pgTable('login_attempts', {
  id: id(),
  email: text('email').notNull(),
  ip: text('ip').notNull(),
  success: boolean('success'),
  // Both purposes count towards the same throttle.
  purpose: text('purpose', { enum: PASSWORD_CHECK_PURPOSES }).notNull().default('sign-in'),
  at: timestamp('at', { withTimezone: true }).notNull().defaultNow(),
}, t => [
  index('login_attempts_email_idx').on(t.email, t.at),
  index('login_attempts_ip_idx').on(t.ip, t.at),
  oneOf('login_attempts_purpose_check', t.purpose, PASSWORD_CHECK_PURPOSES),
])

// Server-side sessions: the sealed cookie names a row; ending the row ends the session wherever the cookie was copied.
export const userSessions = pgTable('user_sessions', {
  id: id(),
  userId: uuid('user_id').notNull().references(() => users.id),
  createdAt: createdAt(),
  lastSeenAt: timestamp('last_seen_at', { withTimezone: true }).notNull().defaultNow(),
  userAgent: text('user_agent'),
  ip: text('ip'),
  revokedAt: timestamp('revoked_at', { withTimezone: true }),
  revokedReason: text('revoked_reason', { enum: SESSION_END_REASONS }),
}, t => [
  index('user_sessions_user_idx').on(t.userId, t.revokedAt),
  oneOf('user_sessions_revoked_reason_check', t.revokedReason, SESSION_END_REASONS),
])

// ─── E-mail: an outbox (sent by a worker, retried) and the fake server's captured messages ─
export const mailOutbox = pgTable('mail_outbox', {
  id: id(),
  to: text('to').array().notNull(),
  subject: text('subject').notNull(),
  text: text('text').notNull(),
  status: text('status', { enum: MAIL_STATUSES }).notNull().default('pending'),
  attempts: integer('attempts').notNull().default(0),
  lastError: text('last_error'),
  dedupeKey: text('dedupe_key').unique(),
  nextAttemptAt: timestamp('next_attempt_at', { withTimezone: true }).notNull().defaultNow(),
  sentAt: timestamp('sent_at', { withTimezone: true }),
  createdAt: createdAt(),
}, t => [
  index('mail_outbox_pending_idx').on(t.status, t.nextAttemptAt),
  oneOf('mail_outbox_status_check', t.status, MAIL_STATUSES),
])

export const capturedMail = pgTable('captured_mail', {
  id: id(),
  from: text('from').notNull(),
  to: text('to').array().notNull(),
  subject: text('subject').notNull(),
  text: text('text').notNull(),
  receivedAt: timestamp('received_at', { withTimezone: true }).notNull().defaultNow(),
}, t => [index('captured_mail_received_idx').on(t.receivedAt)])
