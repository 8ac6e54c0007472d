CREATE TABLE "club_days" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"club_id" uuid NOT NULL,
	"field_id" uuid NOT NULL,
	"day" date NOT NULL,
	"opened_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "club_days_club_field_day_uq" UNIQUE("club_id","field_id","day")
);
--> statement-breakpoint
ALTER TABLE "club_days" ADD CONSTRAINT "club_days_club_id_clubs_id_fk" FOREIGN KEY ("club_id") REFERENCES "public"."clubs"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "club_days" ADD CONSTRAINT "club_days_field_id_club_fields_id_fk" FOREIGN KEY ("field_id") REFERENCES "public"."club_fields"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "club_days" ADD CONSTRAINT "club_days_opened_by_users_id_fk" FOREIGN KEY ("opened_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "club_days_club_id_day_idx" ON "club_days" USING btree ("club_id","day");