ALTER TABLE "slot_records" ALTER COLUMN "slot_id" DROP NOT NULL;--> statement-breakpoint
ALTER TABLE "slot_records" ADD COLUMN "reflight_id" uuid;--> statement-breakpoint
ALTER TABLE "slot_records" ADD CONSTRAINT "slot_records_reflight_id_contest_reflights_id_fk" FOREIGN KEY ("reflight_id") REFERENCES "public"."contest_reflights"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "slot_records_reflight_idx" ON "slot_records" USING btree ("reflight_id");--> statement-breakpoint
ALTER TABLE "slot_records" ADD CONSTRAINT "slot_records_one_holder_ck" CHECK (num_nonnulls("slot_records"."slot_id", "slot_records"."reflight_id") = 1);