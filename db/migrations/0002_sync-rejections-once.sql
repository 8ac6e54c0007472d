DELETE FROM "sync_rejections" AS a USING "sync_rejections" AS b WHERE a."device_id" = b."device_id" AND a."item_id" = b."item_id" AND (a."created_at", a."id") > (b."created_at", b."id");--> statement-breakpoint
DROP INDEX "sync_rejections_device_id_idx";--> statement-breakpoint
ALTER TABLE "sync_rejections" ADD CONSTRAINT "sync_rejections_device_item_uq" UNIQUE("device_id","item_id");
