ALTER TABLE "revisions" ADD COLUMN "reader_file_key" text;--> statement-breakpoint
ALTER TABLE "revisions" ADD COLUMN "reader_size_bytes" bigint;