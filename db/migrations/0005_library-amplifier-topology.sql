ALTER TABLE "library_amplifiers" ADD COLUMN "topology" text DEFAULT 'current-sense' NOT NULL;--> statement-breakpoint
ALTER TABLE "library_amplifiers" ADD COLUMN "common_mode_min_v" double precision;--> statement-breakpoint
ALTER TABLE "library_amplifiers" ADD COLUMN "common_mode_max_v" double precision;