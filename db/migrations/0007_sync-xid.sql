ALTER TABLE "field_sessions" ADD COLUMN "xid" "xid8" DEFAULT pg_current_xact_id() NOT NULL;--> statement-breakpoint
ALTER TABLE "runs" ADD COLUMN "xid" "xid8" DEFAULT pg_current_xact_id() NOT NULL;--> statement-breakpoint
ALTER TABLE "events" ADD COLUMN "xid" "xid8" DEFAULT pg_current_xact_id() NOT NULL;--> statement-breakpoint
CREATE INDEX "field_sessions_xid_seq_idx" ON "field_sessions" USING btree ("xid","server_seq");--> statement-breakpoint
CREATE INDEX "runs_xid_seq_idx" ON "runs" USING btree ("xid","server_seq");--> statement-breakpoint
CREATE INDEX "events_xid_seq_idx" ON "events" USING btree ("xid","server_seq");