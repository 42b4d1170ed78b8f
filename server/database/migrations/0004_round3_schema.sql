CREATE TABLE "user_sessions" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"user_id" uuid NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"last_seen_at" timestamp with time zone DEFAULT now() NOT NULL,
	"user_agent" text,
	"ip" text,
	"revoked_at" timestamp with time zone,
	"revoked_reason" text
);
--> statement-breakpoint
ALTER TABLE "firings" DROP CONSTRAINT "firings_idempotency_key_unique";--> statement-breakpoint
DROP INDEX "runs_plan_idx";--> statement-breakpoint
ALTER TABLE "login_attempts" ALTER COLUMN "success" DROP NOT NULL;--> statement-breakpoint
ALTER TABLE "login_attempts" ADD COLUMN "purpose" text DEFAULT 'sign-in' NOT NULL;--> statement-breakpoint
ALTER TABLE "materials" ADD COLUMN "decomposition_onset_c" double precision;--> statement-breakpoint
ALTER TABLE "materials" ADD COLUMN "decomposition_method" text;--> statement-breakpoint
ALTER TABLE "materials" ADD COLUMN "decomposition_evidence" text;--> statement-breakpoint
ALTER TABLE "materials" ADD COLUMN "decomposition_recorded_by" uuid;--> statement-breakpoint
ALTER TABLE "materials" ADD COLUMN "decomposition_recorded_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "materials" ADD COLUMN "identity_recorded_by" uuid;--> statement-breakpoint
ALTER TABLE "materials" ADD COLUMN "identity_recorded_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "materials" ADD COLUMN "boiling_point_c" double precision;--> statement-breakpoint
ALTER TABLE "materials" ADD COLUMN "vapour_pressure_kpa" double precision;--> statement-breakpoint
ALTER TABLE "materials" ADD COLUMN "chlorine_pct" double precision;--> statement-breakpoint
ALTER TABLE "runs" ADD COLUMN "edited_by" uuid[] DEFAULT '{}'::uuid[] NOT NULL;--> statement-breakpoint
ALTER TABLE "runs" ADD COLUMN "submitted_by" uuid[] DEFAULT '{}'::uuid[] NOT NULL;--> statement-breakpoint
ALTER TABLE "runs" ADD COLUMN "status_reason" text;--> statement-breakpoint
ALTER TABLE "vessels" ADD COLUMN "halogen_resistant" boolean DEFAULT false NOT NULL;--> statement-breakpoint
ALTER TABLE "user_sessions" ADD CONSTRAINT "user_sessions_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "user_sessions_user_idx" ON "user_sessions" USING btree ("user_id","revoked_at");--> statement-breakpoint
ALTER TABLE "materials" ADD CONSTRAINT "materials_decomposition_recorded_by_users_id_fk" FOREIGN KEY ("decomposition_recorded_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "materials" ADD CONSTRAINT "materials_identity_recorded_by_users_id_fk" FOREIGN KEY ("identity_recorded_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "firings_user_idempotency_key_idx" ON "firings" USING btree ("fired_by","idempotency_key");--> statement-breakpoint
CREATE UNIQUE INDEX "runs_plan_seq_unique" ON "runs" USING btree ("plan_id","seq");