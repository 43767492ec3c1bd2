-- The RUM index gave ranked matches straight from the index, but postgresql-15-rum crashes the
-- backend (signal 11, the whole cluster restarts) when pages are written while a ranked search with
-- OR-ed typo corrections runs: reproduced here with bench:search's 50,000 pages, an UPDATE of pages
-- and 8 searching clients; an open upstream report (postgrespro/rum #183) shows the same package
-- crashing after DELETE + VACUUM. Ingest writes pages while students search, so RUM goes and
-- PostgreSQL's own GIN index takes its place (search/postgres.ts ranks a bounded candidate set).
DROP INDEX IF EXISTS "pages_search_rum";--> statement-breakpoint
DROP EXTENSION IF EXISTS rum;--> statement-breakpoint
ALTER TABLE "pages" ADD COLUMN "heading_vector" "tsvector" GENERATED ALWAYS AS (to_tsvector('english', coalesce(heading, ''))) STORED;--> statement-breakpoint
CREATE INDEX "pages_search_gin" ON "pages" USING gin ("search_vector");--> statement-breakpoint
CREATE INDEX "pages_heading_gin" ON "pages" USING gin ("heading_vector");