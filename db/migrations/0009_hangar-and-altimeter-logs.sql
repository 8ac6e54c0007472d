CREATE TYPE "public"."model_status" AS ENUM('flying', 'being-repaired', 'retired', 'sold');--> statement-breakpoint
CREATE TABLE "model_repairs" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"model_id" uuid NOT NULL,
	"repaired_on" date NOT NULL,
	"work" text NOT NULL,
	"mass_after_g" integer,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "models" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"owner_id" uuid NOT NULL,
	"name" text NOT NULL,
	"span_mm" integer NOT NULL,
	"mass_g" integer NOT NULL,
	"marking" text DEFAULT '' NOT NULL,
	"notes" text DEFAULT '' NOT NULL,
	"status" "model_status" DEFAULT 'flying' NOT NULL,
	"owned_since" timestamp with time zone DEFAULT now() NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "altimeter_logs" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"owner_id" uuid NOT NULL,
	"run_id" uuid NOT NULL,
	"lane" smallint NOT NULL,
	"object_key" text NOT NULL,
	"file_name" text NOT NULL,
	"logger_name" text NOT NULL,
	"size_bytes" integer NOT NULL,
	"status" text DEFAULT 'pending' NOT NULL,
	"samples" integer,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "altimeter_logs_object_key_unique" UNIQUE("object_key")
);
--> statement-breakpoint
CREATE TABLE "launch_heights" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"log_id" uuid NOT NULL,
	"run_id" uuid NOT NULL,
	"lane" smallint NOT NULL,
	"at_ms" bigint NOT NULL,
	"height_m" double precision NOT NULL,
	"launch_event_id" uuid,
	"gap_ms" integer,
	"model_id" uuid
);
--> statement-breakpoint
CREATE TABLE "logger_mappings" (
	"owner_id" uuid NOT NULL,
	"logger_name" text NOT NULL,
	"mapping" jsonb NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "logger_mappings_owner_id_logger_name_pk" PRIMARY KEY("owner_id","logger_name")
);
--> statement-breakpoint
ALTER TABLE "model_repairs" ADD CONSTRAINT "model_repairs_model_id_models_id_fk" FOREIGN KEY ("model_id") REFERENCES "public"."models"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "models" ADD CONSTRAINT "models_owner_id_users_id_fk" FOREIGN KEY ("owner_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "altimeter_logs" ADD CONSTRAINT "altimeter_logs_owner_id_users_id_fk" FOREIGN KEY ("owner_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "altimeter_logs" ADD CONSTRAINT "altimeter_logs_run_id_runs_id_fk" FOREIGN KEY ("run_id") REFERENCES "public"."runs"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "launch_heights" ADD CONSTRAINT "launch_heights_log_id_altimeter_logs_id_fk" FOREIGN KEY ("log_id") REFERENCES "public"."altimeter_logs"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "launch_heights" ADD CONSTRAINT "launch_heights_run_id_runs_id_fk" FOREIGN KEY ("run_id") REFERENCES "public"."runs"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "launch_heights" ADD CONSTRAINT "launch_heights_model_id_models_id_fk" FOREIGN KEY ("model_id") REFERENCES "public"."models"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "logger_mappings" ADD CONSTRAINT "logger_mappings_owner_id_users_id_fk" FOREIGN KEY ("owner_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "model_repairs_model_id_idx" ON "model_repairs" USING btree ("model_id");--> statement-breakpoint
CREATE INDEX "models_owner_id_idx" ON "models" USING btree ("owner_id");--> statement-breakpoint
CREATE INDEX "altimeter_logs_run_id_idx" ON "altimeter_logs" USING btree ("run_id");--> statement-breakpoint
CREATE INDEX "altimeter_logs_owner_id_idx" ON "altimeter_logs" USING btree ("owner_id");--> statement-breakpoint
CREATE INDEX "launch_heights_run_id_idx" ON "launch_heights" USING btree ("run_id");--> statement-breakpoint
CREATE INDEX "launch_heights_model_id_idx" ON "launch_heights" USING btree ("model_id");