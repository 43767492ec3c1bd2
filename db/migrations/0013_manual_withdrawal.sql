ALTER TABLE "manuals" ADD COLUMN "withdrawn_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "manuals" ADD COLUMN "withdrawn_by" uuid;--> statement-breakpoint
ALTER TABLE "manuals" ADD COLUMN "withdraw_reason" text DEFAULT '' NOT NULL;--> statement-breakpoint
ALTER TABLE "manuals" ADD CONSTRAINT "manuals_withdrawn_by_users_id_fk" FOREIGN KEY ("withdrawn_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
-- A withdrawn manual leaves search: kept answers must not outlive the change (migration 0008).
DROP TRIGGER IF EXISTS manuals_search_generation ON "manuals";--> statement-breakpoint
CREATE CONSTRAINT TRIGGER manuals_search_generation AFTER INSERT OR DELETE OR UPDATE OF title, document_type, applicability, ata_chapters, current_revision_id, withdrawn_at ON "manuals"
  DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION raise_search_generation();
