CREATE TYPE "public"."recheck_outcome" AS ENUM('open', 'accepted', 'relinked', 'dropped');--> statement-breakpoint
CREATE TYPE "public"."recheck_status" AS ENUM('changed', 'moved', 'removed');--> statement-breakpoint
CREATE TABLE "citation_rechecks" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"revision_id" uuid NOT NULL,
	"previous_revision_id" uuid NOT NULL,
	"card_id" uuid NOT NULL,
	"version_id" uuid NOT NULL,
	"step_id" uuid NOT NULL,
	"step_number" integer NOT NULL,
	"old_page" integer NOT NULL,
	"status" "recheck_status" NOT NULL,
	"suggested_page" integer,
	"similarity" real DEFAULT 0 NOT NULL,
	"outcome" "recheck_outcome" DEFAULT 'open' NOT NULL,
	"chosen_page" integer,
	"resolved_by" uuid,
	"resolved_at" timestamp with time zone,
	"result_version_id" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "revision_comparisons" (
	"revision_id" uuid PRIMARY KEY NOT NULL,
	"previous_revision_id" uuid,
	"pages" jsonb NOT NULL,
	"summary" jsonb NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "citation_rechecks" ADD CONSTRAINT "citation_rechecks_revision_id_revisions_id_fk" FOREIGN KEY ("revision_id") REFERENCES "public"."revisions"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "citation_rechecks" ADD CONSTRAINT "citation_rechecks_previous_revision_id_revisions_id_fk" FOREIGN KEY ("previous_revision_id") REFERENCES "public"."revisions"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "citation_rechecks" ADD CONSTRAINT "citation_rechecks_card_id_task_cards_id_fk" FOREIGN KEY ("card_id") REFERENCES "public"."task_cards"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "citation_rechecks" ADD CONSTRAINT "citation_rechecks_version_id_task_card_versions_id_fk" FOREIGN KEY ("version_id") REFERENCES "public"."task_card_versions"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "citation_rechecks" ADD CONSTRAINT "citation_rechecks_resolved_by_users_id_fk" FOREIGN KEY ("resolved_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "citation_rechecks" ADD CONSTRAINT "citation_rechecks_result_version_id_task_card_versions_id_fk" FOREIGN KEY ("result_version_id") REFERENCES "public"."task_card_versions"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "revision_comparisons" ADD CONSTRAINT "revision_comparisons_revision_id_revisions_id_fk" FOREIGN KEY ("revision_id") REFERENCES "public"."revisions"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "revision_comparisons" ADD CONSTRAINT "revision_comparisons_previous_revision_id_revisions_id_fk" FOREIGN KEY ("previous_revision_id") REFERENCES "public"."revisions"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "citation_rechecks_once_key" ON "citation_rechecks" USING btree ("revision_id","version_id","step_id","old_page");--> statement-breakpoint
CREATE INDEX "citation_rechecks_card_idx" ON "citation_rechecks" USING btree ("card_id","outcome");