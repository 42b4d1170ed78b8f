CREATE TABLE "energy_equivalents" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"vessel_id" uuid NOT NULL,
	"value_j_per_k" double precision NOT NULL,
	"standard_deviation_j_per_k" double precision NOT NULL,
	"relative_standard_deviation_pct" double precision NOT NULL,
	"runs" integer NOT NULL,
	"result_ids" jsonb NOT NULL,
	"mean_energy_j" double precision,
	"accepted_by" uuid NOT NULL,
	"accepted_at" timestamp with time zone DEFAULT now() NOT NULL,
	"active" boolean DEFAULT true NOT NULL
);
--> statement-breakpoint
CREATE TABLE "reports" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"report_number" integer GENERATED ALWAYS AS IDENTITY (sequence name "reports_report_number_seq" INCREMENT BY 1 MINVALUE 1 MAXVALUE 2147483647 START WITH 1001 CACHE 1),
	"sample_code" text NOT NULL,
	"result_ids" jsonb NOT NULL,
	"content" jsonb NOT NULL,
	"issued_by" uuid NOT NULL,
	"issued_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "reports_report_number_unique" UNIQUE("report_number")
);
--> statement-breakpoint
CREATE TABLE "results" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"run_id" uuid NOT NULL,
	"firing_id" uuid NOT NULL,
	"vessel_id" uuid NOT NULL,
	"sample_code" text NOT NULL,
	"kind" text NOT NULL,
	"revision" integer DEFAULT 1 NOT NULL,
	"supersedes_id" uuid,
	"current" boolean DEFAULT true NOT NULL,
	"inputs" jsonb NOT NULL,
	"values" jsonb NOT NULL,
	"energy_equivalent_id" uuid,
	"status" text DEFAULT 'unsigned' NOT NULL,
	"signature_id" uuid,
	"reason" text,
	"created_by" uuid NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "energy_equivalents" ADD CONSTRAINT "energy_equivalents_vessel_id_vessels_id_fk" FOREIGN KEY ("vessel_id") REFERENCES "public"."vessels"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "energy_equivalents" ADD CONSTRAINT "energy_equivalents_accepted_by_users_id_fk" FOREIGN KEY ("accepted_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "reports" ADD CONSTRAINT "reports_issued_by_users_id_fk" FOREIGN KEY ("issued_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "results" ADD CONSTRAINT "results_run_id_runs_id_fk" FOREIGN KEY ("run_id") REFERENCES "public"."runs"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "results" ADD CONSTRAINT "results_firing_id_firings_id_fk" FOREIGN KEY ("firing_id") REFERENCES "public"."firings"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "results" ADD CONSTRAINT "results_vessel_id_vessels_id_fk" FOREIGN KEY ("vessel_id") REFERENCES "public"."vessels"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "results" ADD CONSTRAINT "results_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "energy_equivalents_vessel_idx" ON "energy_equivalents" USING btree ("vessel_id","accepted_at");--> statement-breakpoint
CREATE INDEX "results_sample_idx" ON "results" USING btree ("sample_code","current");--> statement-breakpoint
CREATE INDEX "results_vessel_idx" ON "results" USING btree ("vessel_id","kind","created_at");--> statement-breakpoint
CREATE INDEX "results_run_idx" ON "results" USING btree ("run_id");