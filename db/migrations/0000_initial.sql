CREATE TYPE "public"."ack_status" AS ENUM('applied', 'duplicate', 'rejected');--> statement-breakpoint
CREATE TYPE "public"."club_role" AS ENUM('member', 'coach', 'officer');--> statement-breakpoint
CREATE TYPE "public"."contest_status" AS ENUM('draft', 'open', 'running', 'finished');--> statement-breakpoint
CREATE TYPE "public"."global_role" AS ENUM('member', 'admin');--> statement-breakpoint
CREATE TYPE "public"."payment_status" AS ENUM('pending', 'paid', 'failed', 'refunded');--> statement-breakpoint
CREATE SEQUENCE "public"."sync_seq" INCREMENT BY 1 MINVALUE 1 MAXVALUE 9223372036854775807 START WITH 1 CACHE 1;--> statement-breakpoint
CREATE TABLE "accounts" (
	"user_id" uuid NOT NULL,
	"provider" text NOT NULL,
	"provider_account_id" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "accounts_provider_provider_account_id_pk" PRIMARY KEY("provider","provider_account_id")
);
--> statement-breakpoint
CREATE TABLE "guest_pilots" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"name" text NOT NULL,
	"created_by" uuid NOT NULL,
	"claimed_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "sign_in_throttles" (
	"key" text PRIMARY KEY NOT NULL,
	"failures" integer DEFAULT 0 NOT NULL,
	"window_started_at" timestamp with time zone DEFAULT now() NOT NULL,
	"locked_until" timestamp with time zone
);
--> statement-breakpoint
CREATE TABLE "users" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"email" text NOT NULL,
	"name" text NOT NULL,
	"password_hash" text,
	"role" "global_role" DEFAULT 'member' NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "users_email_unique" UNIQUE("email")
);
--> statement-breakpoint
CREATE TABLE "clubs" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"name" text NOT NULL,
	"slug" text NOT NULL,
	"home_field" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "clubs_slug_unique" UNIQUE("slug")
);
--> statement-breakpoint
CREATE TABLE "coach_grants" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"pilot_id" uuid NOT NULL,
	"coach_id" uuid NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"revoked_at" timestamp with time zone
);
--> statement-breakpoint
CREATE TABLE "invitations" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"club_id" uuid NOT NULL,
	"email" text NOT NULL,
	"role" "club_role" DEFAULT 'member' NOT NULL,
	"token_hash" text NOT NULL,
	"invited_by" uuid NOT NULL,
	"expires_at" timestamp with time zone NOT NULL,
	"accepted_at" timestamp with time zone,
	CONSTRAINT "invitations_token_hash_unique" UNIQUE("token_hash")
);
--> statement-breakpoint
CREATE TABLE "memberships" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"club_id" uuid NOT NULL,
	"user_id" uuid NOT NULL,
	"role" "club_role" DEFAULT 'member' NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "memberships_club_user_uq" UNIQUE("club_id","user_id")
);
--> statement-breakpoint
CREATE TABLE "contest_entries" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"contest_id" uuid NOT NULL,
	"pilot_user_id" uuid,
	"guest_pilot_id" uuid,
	"pilot_name" text NOT NULL,
	"team" text,
	"payment_status" "payment_status" DEFAULT 'pending' NOT NULL,
	"payment_ref" text
);
--> statement-breakpoint
CREATE TABLE "contest_rounds" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"contest_id" uuid NOT NULL,
	"number" smallint NOT NULL,
	"is_fly_off" boolean DEFAULT false NOT NULL,
	"task" jsonb NOT NULL,
	CONSTRAINT "contest_rounds_contest_number_uq" UNIQUE("contest_id","is_fly_off","number")
);
--> statement-breakpoint
CREATE TABLE "contests" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"club_id" uuid NOT NULL,
	"name" text NOT NULL,
	"starts_on" date NOT NULL,
	"field_name" text NOT NULL,
	"status" "contest_status" DEFAULT 'draft' NOT NULL,
	"entry_fee_cents" integer,
	"currency" text DEFAULT 'eur' NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "field_days" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"club_id" uuid NOT NULL,
	"day" date NOT NULL,
	"field_name" text NOT NULL,
	"created_by" uuid NOT NULL
);
--> statement-breakpoint
CREATE TABLE "group_slots" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"round_id" uuid NOT NULL,
	"group_number" smallint NOT NULL,
	"entry_id" uuid NOT NULL,
	"run_id" uuid,
	"lane" smallint,
	"penalty_points" integer DEFAULT 0 NOT NULL,
	CONSTRAINT "group_slots_round_entry_uq" UNIQUE("round_id","entry_id")
);
--> statement-breakpoint
CREATE TABLE "field_sessions" (
	"id" uuid PRIMARY KEY NOT NULL,
	"owner_id" uuid NOT NULL,
	"club_id" uuid,
	"field_day_id" uuid,
	"field_name" text NOT NULL,
	"latitude" double precision,
	"longitude" double precision,
	"conditions" jsonb DEFAULT '{}'::jsonb NOT NULL,
	"started_at" timestamp with time zone NOT NULL,
	"server_seq" bigint DEFAULT nextval('sync_seq') NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "run_lanes" (
	"run_id" uuid NOT NULL,
	"lane" smallint NOT NULL,
	"pilot_user_id" uuid,
	"guest_pilot_id" uuid,
	"pilot_name" text NOT NULL,
	"result_tenths" integer,
	"derived" jsonb,
	"needs_review" boolean DEFAULT false NOT NULL,
	"review_reason" text,
	CONSTRAINT "run_lanes_run_lane_uq" UNIQUE("run_id","lane")
);
--> statement-breakpoint
CREATE TABLE "runs" (
	"id" uuid PRIMARY KEY NOT NULL,
	"session_id" uuid NOT NULL,
	"created_by" uuid NOT NULL,
	"task" jsonb NOT NULL,
	"task_code" text NOT NULL,
	"edition" text NOT NULL,
	"created_at" timestamp with time zone NOT NULL,
	"server_seq" bigint DEFAULT nextval('sync_seq') NOT NULL
);
--> statement-breakpoint
CREATE TABLE "events" (
	"id" uuid PRIMARY KEY NOT NULL,
	"run_id" uuid NOT NULL,
	"device_id" text NOT NULL,
	"seq" integer NOT NULL,
	"recorded_by" uuid NOT NULL,
	"kind" text NOT NULL,
	"body" jsonb NOT NULL,
	"wall_ms" double precision NOT NULL,
	"mono_ms" double precision NOT NULL,
	"page_id" text NOT NULL,
	"offset_theta_ms" double precision,
	"offset_delta_ms" double precision,
	"offset_measured_at_ms" double precision,
	"corrected_ms" double precision NOT NULL,
	"uncertainty_ms" double precision,
	"server_seq" bigint DEFAULT nextval('sync_seq') NOT NULL,
	"received_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "events_device_seq_uq" UNIQUE("device_id","seq")
);
--> statement-breakpoint
CREATE TABLE "clock_samples" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"device_id" text NOT NULL,
	"t1" double precision NOT NULL,
	"t2" double precision NOT NULL,
	"t3" double precision NOT NULL,
	"t4" double precision NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "devices" (
	"id" text PRIMARY KEY NOT NULL,
	"user_id" uuid NOT NULL,
	"label" text,
	"last_seen_at" timestamp with time zone DEFAULT now() NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "sync_rejections" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"item_id" text NOT NULL,
	"device_id" text NOT NULL,
	"user_id" uuid,
	"status" "ack_status" DEFAULT 'rejected' NOT NULL,
	"reason" text NOT NULL,
	"server_seq" bigint,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "altimeter_traces" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"session_id" uuid NOT NULL,
	"uploaded_by" uuid NOT NULL,
	"samples" jsonb NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "coach_notes" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"session_id" uuid NOT NULL,
	"coach_id" uuid NOT NULL,
	"body" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "practice_plans" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"pilot_id" uuid NOT NULL,
	"coach_id" uuid,
	"title" text NOT NULL,
	"items" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "accounts" ADD CONSTRAINT "accounts_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "guest_pilots" ADD CONSTRAINT "guest_pilots_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "guest_pilots" ADD CONSTRAINT "guest_pilots_claimed_by_users_id_fk" FOREIGN KEY ("claimed_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "coach_grants" ADD CONSTRAINT "coach_grants_pilot_id_users_id_fk" FOREIGN KEY ("pilot_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "coach_grants" ADD CONSTRAINT "coach_grants_coach_id_users_id_fk" FOREIGN KEY ("coach_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "invitations" ADD CONSTRAINT "invitations_club_id_clubs_id_fk" FOREIGN KEY ("club_id") REFERENCES "public"."clubs"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "invitations" ADD CONSTRAINT "invitations_invited_by_users_id_fk" FOREIGN KEY ("invited_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "memberships" ADD CONSTRAINT "memberships_club_id_clubs_id_fk" FOREIGN KEY ("club_id") REFERENCES "public"."clubs"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "memberships" ADD CONSTRAINT "memberships_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "contest_entries" ADD CONSTRAINT "contest_entries_contest_id_contests_id_fk" FOREIGN KEY ("contest_id") REFERENCES "public"."contests"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "contest_entries" ADD CONSTRAINT "contest_entries_pilot_user_id_users_id_fk" FOREIGN KEY ("pilot_user_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "contest_entries" ADD CONSTRAINT "contest_entries_guest_pilot_id_guest_pilots_id_fk" FOREIGN KEY ("guest_pilot_id") REFERENCES "public"."guest_pilots"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "contest_rounds" ADD CONSTRAINT "contest_rounds_contest_id_contests_id_fk" FOREIGN KEY ("contest_id") REFERENCES "public"."contests"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "contests" ADD CONSTRAINT "contests_club_id_clubs_id_fk" FOREIGN KEY ("club_id") REFERENCES "public"."clubs"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "field_days" ADD CONSTRAINT "field_days_club_id_clubs_id_fk" FOREIGN KEY ("club_id") REFERENCES "public"."clubs"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "field_days" ADD CONSTRAINT "field_days_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "group_slots" ADD CONSTRAINT "group_slots_round_id_contest_rounds_id_fk" FOREIGN KEY ("round_id") REFERENCES "public"."contest_rounds"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "group_slots" ADD CONSTRAINT "group_slots_entry_id_contest_entries_id_fk" FOREIGN KEY ("entry_id") REFERENCES "public"."contest_entries"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "field_sessions" ADD CONSTRAINT "field_sessions_owner_id_users_id_fk" FOREIGN KEY ("owner_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "field_sessions" ADD CONSTRAINT "field_sessions_club_id_clubs_id_fk" FOREIGN KEY ("club_id") REFERENCES "public"."clubs"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "field_sessions" ADD CONSTRAINT "field_sessions_field_day_id_field_days_id_fk" FOREIGN KEY ("field_day_id") REFERENCES "public"."field_days"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "run_lanes" ADD CONSTRAINT "run_lanes_run_id_runs_id_fk" FOREIGN KEY ("run_id") REFERENCES "public"."runs"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "run_lanes" ADD CONSTRAINT "run_lanes_pilot_user_id_users_id_fk" FOREIGN KEY ("pilot_user_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "run_lanes" ADD CONSTRAINT "run_lanes_guest_pilot_id_guest_pilots_id_fk" FOREIGN KEY ("guest_pilot_id") REFERENCES "public"."guest_pilots"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "runs" ADD CONSTRAINT "runs_session_id_field_sessions_id_fk" FOREIGN KEY ("session_id") REFERENCES "public"."field_sessions"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "runs" ADD CONSTRAINT "runs_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "events" ADD CONSTRAINT "events_run_id_runs_id_fk" FOREIGN KEY ("run_id") REFERENCES "public"."runs"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "events" ADD CONSTRAINT "events_recorded_by_users_id_fk" FOREIGN KEY ("recorded_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "clock_samples" ADD CONSTRAINT "clock_samples_device_id_devices_id_fk" FOREIGN KEY ("device_id") REFERENCES "public"."devices"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "devices" ADD CONSTRAINT "devices_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sync_rejections" ADD CONSTRAINT "sync_rejections_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "altimeter_traces" ADD CONSTRAINT "altimeter_traces_session_id_field_sessions_id_fk" FOREIGN KEY ("session_id") REFERENCES "public"."field_sessions"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "altimeter_traces" ADD CONSTRAINT "altimeter_traces_uploaded_by_users_id_fk" FOREIGN KEY ("uploaded_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "coach_notes" ADD CONSTRAINT "coach_notes_session_id_field_sessions_id_fk" FOREIGN KEY ("session_id") REFERENCES "public"."field_sessions"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "coach_notes" ADD CONSTRAINT "coach_notes_coach_id_users_id_fk" FOREIGN KEY ("coach_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "practice_plans" ADD CONSTRAINT "practice_plans_pilot_id_users_id_fk" FOREIGN KEY ("pilot_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "practice_plans" ADD CONSTRAINT "practice_plans_coach_id_users_id_fk" FOREIGN KEY ("coach_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "accounts_user_id_idx" ON "accounts" USING btree ("user_id");--> statement-breakpoint
CREATE INDEX "guest_pilots_created_by_idx" ON "guest_pilots" USING btree ("created_by");--> statement-breakpoint
CREATE INDEX "coach_grants_coach_id_idx" ON "coach_grants" USING btree ("coach_id");--> statement-breakpoint
CREATE INDEX "coach_grants_pilot_id_idx" ON "coach_grants" USING btree ("pilot_id");--> statement-breakpoint
CREATE INDEX "invitations_club_id_idx" ON "invitations" USING btree ("club_id");--> statement-breakpoint
CREATE INDEX "memberships_user_id_idx" ON "memberships" USING btree ("user_id");--> statement-breakpoint
CREATE INDEX "contest_entries_contest_id_idx" ON "contest_entries" USING btree ("contest_id");--> statement-breakpoint
CREATE INDEX "contests_club_id_idx" ON "contests" USING btree ("club_id");--> statement-breakpoint
CREATE INDEX "field_days_club_id_idx" ON "field_days" USING btree ("club_id");--> statement-breakpoint
CREATE INDEX "field_sessions_owner_id_idx" ON "field_sessions" USING btree ("owner_id");--> statement-breakpoint
CREATE INDEX "field_sessions_server_seq_idx" ON "field_sessions" USING btree ("server_seq");--> statement-breakpoint
CREATE INDEX "run_lanes_pilot_user_id_idx" ON "run_lanes" USING btree ("pilot_user_id");--> statement-breakpoint
CREATE INDEX "runs_session_id_idx" ON "runs" USING btree ("session_id");--> statement-breakpoint
CREATE INDEX "runs_server_seq_idx" ON "runs" USING btree ("server_seq");--> statement-breakpoint
CREATE INDEX "events_run_id_idx" ON "events" USING btree ("run_id");--> statement-breakpoint
CREATE INDEX "events_server_seq_idx" ON "events" USING btree ("server_seq");--> statement-breakpoint
CREATE INDEX "clock_samples_device_id_idx" ON "clock_samples" USING btree ("device_id");--> statement-breakpoint
CREATE INDEX "devices_user_id_idx" ON "devices" USING btree ("user_id");--> statement-breakpoint
CREATE INDEX "sync_rejections_device_id_idx" ON "sync_rejections" USING btree ("device_id");--> statement-breakpoint
CREATE INDEX "altimeter_traces_session_id_idx" ON "altimeter_traces" USING btree ("session_id");--> statement-breakpoint
CREATE INDEX "coach_notes_session_id_idx" ON "coach_notes" USING btree ("session_id");--> statement-breakpoint
CREATE INDEX "practice_plans_pilot_id_idx" ON "practice_plans" USING btree ("pilot_id");