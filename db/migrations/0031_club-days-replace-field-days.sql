-- One concept for a field day: club_days (a club field by id, one per club, field and date) replaces
-- field_days (a field named by text). Days whose field name matches one of the club's fields move over;
-- nothing ever set field_sessions.field_day_id (no push carries it), so that column goes with the table.
INSERT INTO "club_days" ("club_id", "field_id", "day", "opened_by")
SELECT d."club_id", f."id", d."day", d."created_by"
FROM "field_days" d JOIN "club_fields" f ON f."club_id" = d."club_id" AND lower(btrim(f."name")) = lower(btrim(d."field_name"))
ON CONFLICT DO NOTHING;--> statement-breakpoint
ALTER TABLE "field_sessions" DROP CONSTRAINT "field_sessions_field_day_id_field_days_id_fk";--> statement-breakpoint
ALTER TABLE "field_sessions" DROP COLUMN "field_day_id";--> statement-breakpoint
DROP TABLE "field_days";--> statement-breakpoint
ALTER TABLE "memberships" ADD COLUMN "day_summaries" boolean DEFAULT false NOT NULL;--> statement-breakpoint
ALTER TABLE "club_days" ADD COLUMN "closed_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "club_days" ADD COLUMN "closed_by" uuid;--> statement-breakpoint
ALTER TABLE "club_days" ADD COLUMN "summary_sent_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "club_days" ADD CONSTRAINT "club_days_closed_by_users_id_fk" FOREIGN KEY ("closed_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;
