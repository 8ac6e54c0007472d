CREATE TABLE "payment_events" (
	"id" text PRIMARY KEY NOT NULL,
	"type" text NOT NULL,
	"entry_id" uuid,
	"received_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "contest_entries" ADD COLUMN "paid_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "contest_entries" ADD COLUMN "payment_marked_by" uuid;--> statement-breakpoint
ALTER TABLE "contests" ADD COLUMN "entries_close_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "payment_events" ADD CONSTRAINT "payment_events_entry_id_contest_entries_id_fk" FOREIGN KEY ("entry_id") REFERENCES "public"."contest_entries"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "contest_entries" ADD CONSTRAINT "contest_entries_payment_marked_by_users_id_fk" FOREIGN KEY ("payment_marked_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;