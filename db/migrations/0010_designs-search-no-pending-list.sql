-- The trigram indexes rebuilt without a pending list (fastupdate off): PGlite never vacuums, so rows queued
-- there were read in full by every search (db/schema.ts says more). Rebuilding merges what was queued.
DROP INDEX "designs_name_trgm";--> statement-breakpoint
DROP INDEX "designs_project_trgm";--> statement-breakpoint
CREATE INDEX "designs_name_trgm" ON "designs" USING gin ("name" gin_trgm_ops) WITH (fastupdate=false);--> statement-breakpoint
CREATE INDEX "designs_project_trgm" ON "designs" USING gin ("project" gin_trgm_ops) WITH (fastupdate=false);