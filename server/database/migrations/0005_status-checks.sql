ALTER TABLE "aid_values" ADD CONSTRAINT "aid_values_kind_check" CHECK ("aid_values"."kind" in ('capsule', 'tape', 'oil', 'cotton', 'other'));--> statement-breakpoint
ALTER TABLE "firings" ADD CONSTRAINT "firings_outcome_check" CHECK ("firings"."outcome" in ('complete', 'incomplete', 'misfire', 'leak', 'overpressure'));--> statement-breakpoint
ALTER TABLE "login_attempts" ADD CONSTRAINT "login_attempts_purpose_check" CHECK ("login_attempts"."purpose" in ('sign-in', 'signature'));--> statement-breakpoint
ALTER TABLE "mail_outbox" ADD CONSTRAINT "mail_outbox_status_check" CHECK ("mail_outbox"."status" in ('pending', 'sent', 'failed'));--> statement-breakpoint
ALTER TABLE "materials" ADD CONSTRAINT "materials_category_check" CHECK ("materials"."category" in ('coal', 'coke', 'biomass', 'liquid fuel', 'waste fuel', 'food', 'feed', 'polymer', 'reference standard', 'combustion aid', 'chemical', 'other'));--> statement-breakpoint
ALTER TABLE "materials" ADD CONSTRAINT "materials_composition_basis_check" CHECK ("materials"."composition_basis" in ('dry', 'as-received', 'air-dried'));--> statement-breakpoint
ALTER TABLE "materials" ADD CONSTRAINT "materials_declared_hazard_check" CHECK ("materials"."declared_hazard" in ('none', 'energetic', 'oxidiser'));--> statement-breakpoint
ALTER TABLE "results" ADD CONSTRAINT "results_kind_check" CHECK ("results"."kind" in ('sample', 'standardisation', 'check'));--> statement-breakpoint
ALTER TABLE "results" ADD CONSTRAINT "results_status_check" CHECK ("results"."status" in ('unsigned', 'signed'));--> statement-breakpoint
ALTER TABLE "runs" ADD CONSTRAINT "runs_kind_check" CHECK ("runs"."kind" in ('sample', 'standardisation', 'check'));--> statement-breakpoint
ALTER TABLE "runs" ADD CONSTRAINT "runs_status_check" CHECK ("runs"."status" in ('draft', 'ready', 'awaiting-approval', 'blocked', 'rejected', 'fired', 'withdrawn'));--> statement-breakpoint
ALTER TABLE "runs" ADD CONSTRAINT "runs_verdict_check" CHECK ("runs"."verdict" in ('clear', 'needs-approval', 'blocked'));--> statement-breakpoint
ALTER TABLE "samples" ADD CONSTRAINT "samples_status_check" CHECK ("samples"."status" in ('received', 'planned', 'tested', 'reported', 'rejected'));--> statement-breakpoint
ALTER TABLE "services" ADD CONSTRAINT "services_kind_check" CHECK ("services"."kind" in ('routine', 'requalification', 'inspection', 'repair', 'lock-out', 'return-to-service', 'sent-away'));--> statement-breakpoint
ALTER TABLE "signatures" ADD CONSTRAINT "signatures_entity_check" CHECK ("signatures"."entity" in ('run', 'result', 'energy-equivalent', 'aid-value', 'vessel'));--> statement-breakpoint
ALTER TABLE "signatures" ADD CONSTRAINT "signatures_meaning_check" CHECK ("signatures"."meaning" in ('approved as an exception', 'rejected', 'result signed off', 'standardisation series accepted', 'aid value series accepted'));--> statement-breakpoint
ALTER TABLE "user_sessions" ADD CONSTRAINT "user_sessions_revoked_reason_check" CHECK ("user_sessions"."revoked_reason" in ('sign-out', 'expired', 'password-change', 'password-reset', 'role-change', 'disabled', 'ended-by-user', 'ended-by-admin'));--> statement-breakpoint
ALTER TABLE "users" ADD CONSTRAINT "users_roles_check" CHECK ("users"."roles" <@ array['analyst', 'supervisor', 'technician', 'admin']::text[]);--> statement-breakpoint
ALTER TABLE "vessels" ADD CONSTRAINT "vessels_class_check" CHECK ("vessels"."class" in ('standard', 'high-strength'));--> statement-breakpoint
ALTER TABLE "vessels" ADD CONSTRAINT "vessels_condition_check" CHECK ("vessels"."condition" in ('normal', 'locked-out', 'away', 'awaiting-verification', 'retired'));--> statement-breakpoint
ALTER TABLE "vessels" ADD CONSTRAINT "vessels_notified_state_check" CHECK ("vessels"."notified_state" in ('in-service', 'service-due', 'overdue', 'requalification-due', 'locked-out', 'away', 'awaiting-verification', 'retired'));