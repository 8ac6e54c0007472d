ALTER TABLE "practice_plans" ADD COLUMN "updated_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "practice_plans" ADD COLUMN "closed_at" timestamp with time zone;--> statement-breakpoint
-- a link to a plan that is gone (none should be: the push keeps only links to the creator's own plans) is dropped before the key holds
UPDATE "runs" SET "plan_id" = NULL, "plan_item" = NULL WHERE "plan_id" IS NOT NULL AND NOT EXISTS (SELECT 1 FROM "practice_plans" p WHERE p."id" = "runs"."plan_id");--> statement-breakpoint
ALTER TABLE "runs" ADD CONSTRAINT "runs_plan_id_practice_plans_id_fk" FOREIGN KEY ("plan_id") REFERENCES "public"."practice_plans"("id") ON DELETE set null ON UPDATE no action;