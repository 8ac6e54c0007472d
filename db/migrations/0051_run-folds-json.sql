-- The folded state is only ever stored whole and read whole (db/queries/sync-push-load.ts embeds it in the load's JSON):
-- as json its text is checked and kept as sent, instead of being parsed into jsonb on every push and printed back on every load.
ALTER TABLE "run_folds" ALTER COLUMN "state" SET DATA TYPE json USING "state"::json;--> statement-breakpoint
ALTER TABLE "run_folds" ALTER COLUMN "state" SET COMPRESSION lz4;
