-- Trigram indexes for the designs list's search (a substring of the name or project, ILIKE '%q%').
-- pg_trgm ships with PostgreSQL (contrib, a trusted extension since 13) and with PGlite (loaded in db/client.ts).
CREATE EXTENSION IF NOT EXISTS pg_trgm;--> statement-breakpoint
CREATE INDEX "designs_name_trgm" ON "designs" USING gin ("name" gin_trgm_ops);--> statement-breakpoint
CREATE INDEX "designs_project_trgm" ON "designs" USING gin ("project" gin_trgm_ops);