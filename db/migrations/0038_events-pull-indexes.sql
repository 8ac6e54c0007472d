-- A pull reads each visible run's events after its cursor through (run_id, xid, server_seq)
-- (db/queries/sync-pull.ts) instead of every user's events after the cursor filtered down to the
-- visible runs: with 70,000 events stored a first pull read them all (~200 ms of a busy database
-- per pull while 100 phones pushed). That index also serves every other read of a run's events and
-- the foreign key, so the run_id index goes; server_seq and (xid, server_seq) on events had no
-- reader left, and each index costs every event insert. runs.created_by: the visible runs of a user.
CREATE INDEX "events_run_xid_seq_idx" ON "events" USING btree ("run_id","xid","server_seq");--> statement-breakpoint
CREATE INDEX "runs_created_by_idx" ON "runs" USING btree ("created_by");--> statement-breakpoint
DROP INDEX "events_run_id_idx";--> statement-breakpoint
DROP INDEX "events_server_seq_idx";--> statement-breakpoint
DROP INDEX "events_xid_seq_idx";
