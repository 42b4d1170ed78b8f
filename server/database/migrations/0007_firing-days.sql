CREATE TABLE "vessel_firing_days" (
	"vessel_id" uuid NOT NULL,
	"day" date NOT NULL,
	"firings" integer NOT NULL,
	CONSTRAINT "vessel_firing_days_vessel_id_day_pk" PRIMARY KEY("vessel_id","day"),
	CONSTRAINT "vessel_firing_days_firings_check" CHECK ("vessel_firing_days"."firings" >= 0)
);
--> statement-breakpoint
ALTER TABLE "vessel_firing_days" ADD CONSTRAINT "vessel_firing_days_vessel_id_vessels_id_fk" FOREIGN KEY ("vessel_id") REFERENCES "public"."vessels"("id") ON DELETE no action ON UPDATE no action;