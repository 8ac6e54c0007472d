ALTER TABLE "contest_entries" ADD COLUMN "models" jsonb DEFAULT '[]'::jsonb NOT NULL;--> statement-breakpoint
ALTER TABLE "contest_entries" ADD COLUMN "keep_apart" text;--> statement-breakpoint
ALTER TABLE "contest_entries" ADD COLUMN "paper" boolean DEFAULT false NOT NULL;--> statement-breakpoint
ALTER TABLE "contest_entries" ADD COLUMN "withdrawn_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "contest_entries" ADD COLUMN "created_at" timestamp with time zone DEFAULT now() NOT NULL;--> statement-breakpoint
ALTER TABLE "contests" ADD COLUMN "max_group_size" smallint DEFAULT 10 NOT NULL;--> statement-breakpoint
ALTER TABLE "contests" ADD COLUMN "prep_minutes" smallint DEFAULT 5 NOT NULL;--> statement-breakpoint
ALTER TABLE "contests" ADD COLUMN "no_fly_seconds" smallint DEFAULT 60 NOT NULL;--> statement-breakpoint
ALTER TABLE "contests" ADD COLUMN "drop_rule" text DEFAULT 'f3k' NOT NULL;--> statement-breakpoint
ALTER TABLE "contests" ADD COLUMN "practice" boolean DEFAULT false NOT NULL;--> statement-breakpoint
ALTER TABLE "contests" ADD COLUMN "draw_seed" integer;--> statement-breakpoint
ALTER TABLE "contests" ADD COLUMN "draw_locked_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "contests" ADD COLUMN "created_by" uuid;--> statement-breakpoint
ALTER TABLE "contests" ADD CONSTRAINT "contests_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "contest_entries_one_live_uq" ON "contest_entries" USING btree ("contest_id","pilot_user_id") WHERE withdrawn_at is null and pilot_user_id is not null;