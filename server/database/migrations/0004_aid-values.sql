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
ALTER TABLE "aid_values" ADD CONSTRAINT "aid_values_material_id_materials_id_fk" FOREIGN KEY ("material_id") REFERENCES "public"."materials"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "aid_values" ADD CONSTRAINT "aid_values_accepted_by_users_id_fk" FOREIGN KEY ("accepted_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "aid_values_material_idx" ON "aid_values" USING btree ("material_id","active");--> statement-breakpoint
CREATE INDEX "aid_values_kind_idx" ON "aid_values" USING btree ("kind","active");