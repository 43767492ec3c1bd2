CREATE EXTENSION IF NOT EXISTS rum;
--> statement-breakpoint
CREATE EXTENSION IF NOT EXISTS pg_trgm;
--> statement-breakpoint
CREATE EXTENSION IF NOT EXISTS fuzzystrmatch;
--> statement-breakpoint
CREATE TABLE "search_words" (
	"word" text PRIMARY KEY NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "pages" ADD COLUMN "search_vector" "tsvector" GENERATED ALWAYS AS (setweight(to_tsvector('english', coalesce(heading, '')), 'A') || setweight(to_tsvector('english', coalesce(text, '')), 'B')) STORED;--> statement-breakpoint
-- Written by hand (drizzle-kit cannot express these): RUM ranks matches inside the index, so
-- "ORDER BY search_vector <=> query LIMIT n" reads only the best n; trigrams find near spellings.
CREATE INDEX "pages_search_rum" ON "pages" USING rum ("search_vector" rum_tsvector_ops);
--> statement-breakpoint
CREATE INDEX "search_words_trgm" ON "search_words" USING gin ("word" gin_trgm_ops);
--> statement-breakpoint
-- Pages read before this migration: their words, for typo correction.
INSERT INTO "search_words" ("word") SELECT word FROM ts_stat('SELECT search_vector FROM pages') WHERE length(word) BETWEEN 3 AND 40 ON CONFLICT DO NOTHING;
