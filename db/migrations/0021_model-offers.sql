CREATE TABLE "model_offers" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"model_id" uuid NOT NULL,
	"seller_id" uuid NOT NULL,
	"email" text NOT NULL,
	"with_history" boolean NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"expires_at" timestamp with time zone NOT NULL,
	"answer" text,
	"answered_at" timestamp with time zone
);
--> statement-breakpoint
ALTER TABLE "model_offers" ADD CONSTRAINT "model_offers_model_id_models_id_fk" FOREIGN KEY ("model_id") REFERENCES "public"."models"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "model_offers" ADD CONSTRAINT "model_offers_seller_id_users_id_fk" FOREIGN KEY ("seller_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "model_offers_model_id_idx" ON "model_offers" USING btree ("model_id");--> statement-breakpoint
CREATE INDEX "model_offers_email_idx" ON "model_offers" USING btree ("email");