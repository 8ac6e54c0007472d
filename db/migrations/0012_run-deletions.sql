CREATE TABLE "run_deletions" (
	"run_id" uuid PRIMARY KEY NOT NULL,
	"deleted_by" uuid,
	"seen_by" uuid[] NOT NULL,
	"deleted_at" timestamp with time zone DEFAULT now() NOT NULL,
	"server_seq" bigint DEFAULT nextval('sync_seq') NOT NULL,
	"xid" "xid8" DEFAULT pg_current_xact_id() NOT NULL
);
--> statement-breakpoint
CREATE INDEX "run_deletions_xid_seq_idx" ON "run_deletions" USING btree ("xid","server_seq");