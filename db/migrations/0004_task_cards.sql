CREATE TYPE "public"."card_version_status" AS ENUM('draft', 'published');--> statement-breakpoint
CREATE TABLE "card_citations" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"version_id" uuid NOT NULL,
	"step_id" uuid NOT NULL,
	"step_number" integer NOT NULL,
	"manual_id" uuid NOT NULL,
	"revision_id" uuid NOT NULL,
	"page_number" integer NOT NULL,
	"quote" text DEFAULT '' NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "curriculum_subjects" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"name" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "task_card_versions" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"card_id" uuid NOT NULL,
	"number" integer NOT NULL,
	"status" "card_version_status" DEFAULT 'draft' NOT NULL,
	"title" text NOT NULL,
	"applicability" text[] DEFAULT '{}'::text[] NOT NULL,
	"ata_chapter" text DEFAULT '' NOT NULL,
	"subject_id" uuid,
	"estimated_minutes" integer,
	"tools" text[] DEFAULT '{}'::text[] NOT NULL,
	"consumables" text[] DEFAULT '{}'::text[] NOT NULL,
	"protective_equipment" text[] DEFAULT '{}'::text[] NOT NULL,
	"steps" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"edit_count" integer DEFAULT 0 NOT NULL,
	"created_by" uuid,
	"published_at" timestamp with time zone,
	"published_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "task_cards" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"owner_id" uuid,
	"duplicated_from" uuid,
	"archived_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "card_citations" ADD CONSTRAINT "card_citations_version_id_task_card_versions_id_fk" FOREIGN KEY ("version_id") REFERENCES "public"."task_card_versions"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "card_citations" ADD CONSTRAINT "card_citations_manual_id_manuals_id_fk" FOREIGN KEY ("manual_id") REFERENCES "public"."manuals"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "card_citations" ADD CONSTRAINT "card_citations_revision_id_revisions_id_fk" FOREIGN KEY ("revision_id") REFERENCES "public"."revisions"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "task_card_versions" ADD CONSTRAINT "task_card_versions_card_id_task_cards_id_fk" FOREIGN KEY ("card_id") REFERENCES "public"."task_cards"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "task_card_versions" ADD CONSTRAINT "task_card_versions_subject_id_curriculum_subjects_id_fk" FOREIGN KEY ("subject_id") REFERENCES "public"."curriculum_subjects"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "task_card_versions" ADD CONSTRAINT "task_card_versions_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "task_card_versions" ADD CONSTRAINT "task_card_versions_published_by_users_id_fk" FOREIGN KEY ("published_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "task_cards" ADD CONSTRAINT "task_cards_owner_id_users_id_fk" FOREIGN KEY ("owner_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "task_cards" ADD CONSTRAINT "task_cards_duplicated_from_task_cards_id_fk" FOREIGN KEY ("duplicated_from") REFERENCES "public"."task_cards"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "card_citations_revision_page_idx" ON "card_citations" USING btree ("revision_id","page_number");--> statement-breakpoint
CREATE INDEX "card_citations_version_idx" ON "card_citations" USING btree ("version_id");--> statement-breakpoint
CREATE UNIQUE INDEX "curriculum_subjects_name_key" ON "curriculum_subjects" USING btree ("name");--> statement-breakpoint
CREATE UNIQUE INDEX "task_card_versions_card_number_key" ON "task_card_versions" USING btree ("card_id","number");--> statement-breakpoint
CREATE UNIQUE INDEX "task_card_versions_one_draft_key" ON "task_card_versions" USING btree ("card_id") WHERE status = 'draft';--> statement-breakpoint
CREATE INDEX "task_card_versions_subject_idx" ON "task_card_versions" USING btree ("subject_id");--> statement-breakpoint
-- A published version is frozen in the database itself, whatever code talks to it: no update and no
-- delete of the version, and no change to its citations. SQLSTATE HLF01 is mapped to 409 by lib/cards.
CREATE FUNCTION hl_freeze_published_version() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  IF OLD.status = 'published' THEN
    RAISE EXCEPTION 'task card version % is published and cannot change', OLD.id USING ERRCODE = 'HLF01';
  END IF;
  IF TG_OP = 'DELETE' THEN
    RETURN OLD;
  END IF;
  RETURN NEW;
END $$;--> statement-breakpoint
CREATE TRIGGER task_card_versions_frozen BEFORE UPDATE OR DELETE ON "task_card_versions"
  FOR EACH ROW EXECUTE FUNCTION hl_freeze_published_version();--> statement-breakpoint
CREATE FUNCTION hl_freeze_published_citations() RETURNS trigger LANGUAGE plpgsql AS $$
DECLARE
  target uuid := CASE WHEN TG_OP = 'INSERT' THEN NEW.version_id ELSE OLD.version_id END;
BEGIN
  IF EXISTS (SELECT 1 FROM task_card_versions WHERE id = target AND status = 'published') THEN
    RAISE EXCEPTION 'the citations of published task card version % cannot change', target USING ERRCODE = 'HLF01';
  END IF;
  IF TG_OP = 'DELETE' THEN
    RETURN OLD;
  END IF;
  RETURN NEW;
END $$;--> statement-breakpoint
CREATE TRIGGER card_citations_frozen BEFORE INSERT OR UPDATE OR DELETE ON "card_citations"
  FOR EACH ROW EXECUTE FUNCTION hl_freeze_published_citations();
