DROP INDEX "runs_plan_idx";--> statement-breakpoint
ALTER TABLE "runs" ADD COLUMN "edited_by" uuid[] DEFAULT '{}'::uuid[] NOT NULL;--> statement-breakpoint
ALTER TABLE "runs" ADD COLUMN "submitted_by" uuid[] DEFAULT '{}'::uuid[] NOT NULL;--> statement-breakpoint
ALTER TABLE "runs" ADD COLUMN "status_reason" text;--> statement-breakpoint
CREATE UNIQUE INDEX "runs_plan_seq_unique" ON "runs" USING btree ("plan_id","seq");