CREATE TABLE "search_generation" (
	"id" boolean PRIMARY KEY DEFAULT true NOT NULL,
	"n" bigint DEFAULT 0 NOT NULL,
	CONSTRAINT "search_generation_one_row" CHECK ("search_generation"."id")
);
--> statement-breakpoint
-- Starting at the creation time in microseconds: a database dropped and made again under a running
-- server does not give numbers it already kept answers under.
INSERT INTO "search_generation" (n) VALUES ((extract(epoch from clock_timestamp()) * 1000000)::bigint);--> statement-breakpoint
-- Raised by every transaction that changes what a search finds or shows: a manual's title, type,
-- applicability, ATA chapters or current revision; a revision's status, label or manual; any page
-- text or heading; the word list behind typo corrections. (Progress and heartbeat updates of a
-- revision being read are left out by the column lists.) The new number commits with the change,
-- so an answer kept under the old number was computed from the old data.
-- The raise is deferred to the commit and done once per transaction: taken last, the row's lock
-- cannot be part of a deadlock (a transaction holding it is committing and waits for nothing else).
-- Writers in REPEATABLE READ or SERIALIZABLE would fail at commit when another raised it first;
-- the app's writers all run in READ COMMITTED.
CREATE FUNCTION raise_search_generation() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  IF current_setting('hangarleaf.search_generation_raised', true) IS DISTINCT FROM txid_current()::text THEN
    PERFORM set_config('hangarleaf.search_generation_raised', txid_current()::text, true);
    UPDATE search_generation SET n = n + 1;
  END IF;
  RETURN NULL;
END $$;--> statement-breakpoint
CREATE CONSTRAINT TRIGGER manuals_search_generation AFTER INSERT OR DELETE OR UPDATE OF title, document_type, applicability, ata_chapters, current_revision_id ON "manuals"
  DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION raise_search_generation();--> statement-breakpoint
CREATE CONSTRAINT TRIGGER revisions_search_generation AFTER INSERT OR DELETE OR UPDATE OF status, label, manual_id ON "revisions"
  DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION raise_search_generation();--> statement-breakpoint
CREATE CONSTRAINT TRIGGER pages_search_generation AFTER INSERT OR DELETE OR UPDATE OF text, heading, revision_id, page_number ON "pages"
  DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION raise_search_generation();--> statement-breakpoint
CREATE CONSTRAINT TRIGGER search_words_search_generation AFTER INSERT OR DELETE OR UPDATE ON "search_words"
  DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION raise_search_generation();--> statement-breakpoint
-- TRUNCATE has no row triggers and raises at once (only resets of a development database use it;
-- it locks the whole table anyway).
CREATE FUNCTION raise_search_generation_now() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  UPDATE search_generation SET n = n + 1;
  RETURN NULL;
END $$;--> statement-breakpoint
CREATE TRIGGER manuals_search_generation_truncate AFTER TRUNCATE ON "manuals" FOR EACH STATEMENT EXECUTE FUNCTION raise_search_generation_now();--> statement-breakpoint
CREATE TRIGGER revisions_search_generation_truncate AFTER TRUNCATE ON "revisions" FOR EACH STATEMENT EXECUTE FUNCTION raise_search_generation_now();--> statement-breakpoint
CREATE TRIGGER pages_search_generation_truncate AFTER TRUNCATE ON "pages" FOR EACH STATEMENT EXECUTE FUNCTION raise_search_generation_now();--> statement-breakpoint
CREATE TRIGGER search_words_search_generation_truncate AFTER TRUNCATE ON "search_words" FOR EACH STATEMENT EXECUTE FUNCTION raise_search_generation_now();
