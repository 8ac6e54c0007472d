ALTER TABLE "models" ADD COLUMN "former_owner_ids" uuid[] DEFAULT '{}'::uuid[] NOT NULL;--> statement-breakpoint
ALTER TABLE "launch_heights" ADD COLUMN "flight_index" smallint;