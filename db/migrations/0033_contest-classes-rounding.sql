ALTER TABLE "contest_entries" ADD COLUMN "pilot_class" text DEFAULT 'senior' NOT NULL;--> statement-breakpoint
ALTER TABLE "contests" ADD COLUMN "halves" text DEFAULT 'half-up' NOT NULL;--> statement-breakpoint
ALTER TABLE "contests" ADD COLUMN "rules_edition" text DEFAULT 'F3K-2025' NOT NULL;