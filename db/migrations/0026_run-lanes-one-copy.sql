ALTER TABLE "run_lanes" DROP COLUMN "season_flights";--> statement-breakpoint
-- The derived caches are rewritten whole on every push into their run: LZ4 compresses them several
-- times faster than the default (pglz), for a little more room (issue #11, a 5,000-event run). New
-- values only; rows already stored stay as they are until their next write.
ALTER TABLE "run_lanes" ALTER COLUMN "derived" SET COMPRESSION lz4;--> statement-breakpoint
ALTER TABLE "run_folds" ALTER COLUMN "state" SET COMPRESSION lz4;
