CREATE TABLE "page_marks" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"user_id" uuid NOT NULL,
	"manual_id" uuid NOT NULL,
	"revision_id" uuid NOT NULL,
	"page_number" integer NOT NULL,
	"kind" text NOT NULL,
	"text" text DEFAULT '' NOT NULL,
	"class_id" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "page_marks_kind" CHECK ("page_marks"."kind" in ('bookmark', 'note')),
	CONSTRAINT "page_marks_page" CHECK ("page_marks"."page_number" >= 1)
);
--> statement-breakpoint
ALTER TABLE "page_marks" ADD CONSTRAINT "page_marks_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "page_marks" ADD CONSTRAINT "page_marks_manual_id_manuals_id_fk" FOREIGN KEY ("manual_id") REFERENCES "public"."manuals"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "page_marks" ADD CONSTRAINT "page_marks_revision_id_revisions_id_fk" FOREIGN KEY ("revision_id") REFERENCES "public"."revisions"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "page_marks" ADD CONSTRAINT "page_marks_class_id_classes_id_fk" FOREIGN KEY ("class_id") REFERENCES "public"."classes"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "page_marks_manual_idx" ON "page_marks" USING btree ("manual_id","user_id");