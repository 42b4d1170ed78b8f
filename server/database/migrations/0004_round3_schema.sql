CREATE SEQUENCE "public"."sample_lab_code_seq" INCREMENT BY 1 MINVALUE 1 MAXVALUE 9223372036854775807 START WITH 1 CACHE 1;--> statement-breakpoint
CREATE TABLE "aid_values" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"kind" text NOT NULL,
	"material_id" uuid,
	"lot" text DEFAULT '' NOT NULL,
	"determinations_j_per_g" jsonb NOT NULL,
	"runs" integer NOT NULL,
	"mean_j_per_g" double precision NOT NULL,
	"standard_deviation_j_per_g" double precision NOT NULL,
	"standard_uncertainty_j_per_g" double precision NOT NULL,
	"note" text DEFAULT '' NOT NULL,
	"accepted_by" uuid NOT NULL,
	"signature_id" uuid,
	"accepted_at" timestamp with time zone DEFAULT now() NOT NULL,
	"active" boolean DEFAULT true NOT NULL
);
--> statement-breakpoint
CREATE TABLE "clients" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"name" text NOT NULL,
	"contact_name" text,
	"contact_email" text,
	"address" text,
	"created_by" uuid NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "clients_name_unique" UNIQUE("name")
);
--> statement-breakpoint
CREATE TABLE "day_plans" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"day" date NOT NULL,
	"vessel_ids" jsonb NOT NULL,
	"proposal" jsonb NOT NULL,
	"accepted_by" uuid NOT NULL,
	"accepted_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "samples" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"lab_code" text NOT NULL,
	"client_id" uuid NOT NULL,
	"client_reference" text,
	"description" text NOT NULL,
	"material_id" uuid,
	"received_at" timestamp with time zone NOT NULL,
	"condition" text,
	"received_mass_g" double precision,
	"note" text DEFAULT '' NOT NULL,
	"status" text DEFAULT 'received' NOT NULL,
	"rejection_reason" text,
	"received_by" uuid NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "samples_lab_code_unique" UNIQUE("lab_code")
);
--> statement-breakpoint
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
ALTER TABLE "attachments" ADD COLUMN "sample_id" uuid;--> statement-breakpoint
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
ALTER TABLE "runs" ADD COLUMN "sample_id" uuid;--> statement-breakpoint
ALTER TABLE "runs" ADD COLUMN "day_plan_id" uuid;--> statement-breakpoint
ALTER TABLE "runs" ADD COLUMN "day_order" integer;--> statement-breakpoint
ALTER TABLE "runs" ADD COLUMN "edited_by" uuid[] DEFAULT '{}'::uuid[] NOT NULL;--> statement-breakpoint
ALTER TABLE "runs" ADD COLUMN "submitted_by" uuid[] DEFAULT '{}'::uuid[] NOT NULL;--> statement-breakpoint
ALTER TABLE "runs" ADD COLUMN "status_reason" text;--> statement-breakpoint
ALTER TABLE "vessels" ADD COLUMN "halogen_resistant" boolean DEFAULT false NOT NULL;--> statement-breakpoint
ALTER TABLE "aid_values" ADD CONSTRAINT "aid_values_material_id_materials_id_fk" FOREIGN KEY ("material_id") REFERENCES "public"."materials"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "aid_values" ADD CONSTRAINT "aid_values_accepted_by_users_id_fk" FOREIGN KEY ("accepted_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "clients" ADD CONSTRAINT "clients_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "day_plans" ADD CONSTRAINT "day_plans_accepted_by_users_id_fk" FOREIGN KEY ("accepted_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "samples" ADD CONSTRAINT "samples_client_id_clients_id_fk" FOREIGN KEY ("client_id") REFERENCES "public"."clients"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "samples" ADD CONSTRAINT "samples_material_id_materials_id_fk" FOREIGN KEY ("material_id") REFERENCES "public"."materials"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "samples" ADD CONSTRAINT "samples_received_by_users_id_fk" FOREIGN KEY ("received_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "user_sessions" ADD CONSTRAINT "user_sessions_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "aid_values_material_idx" ON "aid_values" USING btree ("material_id","active");--> statement-breakpoint
CREATE INDEX "aid_values_kind_idx" ON "aid_values" USING btree ("kind","active");--> statement-breakpoint
CREATE INDEX "day_plans_day_idx" ON "day_plans" USING btree ("day");--> statement-breakpoint
CREATE INDEX "samples_status_idx" ON "samples" USING btree ("status","received_at");--> statement-breakpoint
CREATE INDEX "samples_client_idx" ON "samples" USING btree ("client_id");--> statement-breakpoint
CREATE INDEX "user_sessions_user_idx" ON "user_sessions" USING btree ("user_id","revoked_at");--> statement-breakpoint
ALTER TABLE "attachments" ADD CONSTRAINT "attachments_sample_id_samples_id_fk" FOREIGN KEY ("sample_id") REFERENCES "public"."samples"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "materials" ADD CONSTRAINT "materials_decomposition_recorded_by_users_id_fk" FOREIGN KEY ("decomposition_recorded_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "materials" ADD CONSTRAINT "materials_identity_recorded_by_users_id_fk" FOREIGN KEY ("identity_recorded_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "runs" ADD CONSTRAINT "runs_sample_id_samples_id_fk" FOREIGN KEY ("sample_id") REFERENCES "public"."samples"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "runs" ADD CONSTRAINT "runs_day_plan_id_day_plans_id_fk" FOREIGN KEY ("day_plan_id") REFERENCES "public"."day_plans"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "firings_user_idempotency_key_idx" ON "firings" USING btree ("fired_by","idempotency_key");--> statement-breakpoint
CREATE UNIQUE INDEX "runs_plan_seq_unique" ON "runs" USING btree ("plan_id","seq");--> statement-breakpoint
CREATE INDEX "runs_sample_idx" ON "runs" USING btree ("sample_id");