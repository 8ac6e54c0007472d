CREATE TABLE "device_clock_estimates" (
	"device_id" text NOT NULL,
	"theta_ms" double precision NOT NULL,
	"delta_ms" double precision NOT NULL,
	"measured_at_wall_ms" double precision NOT NULL,
	"received_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "device_clock_estimates_device_measured_uq" UNIQUE("device_id","measured_at_wall_ms")
);
--> statement-breakpoint
ALTER TABLE "device_clock_estimates" ADD CONSTRAINT "device_clock_estimates_device_id_devices_id_fk" FOREIGN KEY ("device_id") REFERENCES "public"."devices"("id") ON DELETE cascade ON UPDATE no action;