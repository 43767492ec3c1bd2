CREATE TABLE "standard_elements" (
	"code" text PRIMARY KEY NOT NULL,
	"section" text NOT NULL,
	"area_letter" text NOT NULL,
	"area_title" text NOT NULL,
	"kind" text NOT NULL,
	"number" integer NOT NULL,
	"title" text NOT NULL,
	"excerpt" boolean DEFAULT false NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "standard_elements_kind" CHECK ("standard_elements"."kind" in ('knowledge', 'risk', 'skill'))
);
--> statement-breakpoint
CREATE INDEX "standard_elements_search_idx" ON "standard_elements" USING gin (to_tsvector('english', "code" || ' ' || "area_title" || ' ' || "title"));