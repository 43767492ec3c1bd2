CREATE TYPE "public"."run_status" AS ENUM('not_started', 'in_progress', 'submitted', 'returned', 'signed_off');--> statement-breakpoint
CREATE TABLE "assignments" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"card_id" uuid NOT NULL,
	"version_id" uuid NOT NULL,
	"class_id" uuid,
	"due_on" date,
	"note" text DEFAULT '' NOT NULL,
	"assigned_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "run_events" (
	"id" uuid PRIMARY KEY NOT NULL,
	"run_id" uuid NOT NULL,
	"user_id" uuid NOT NULL,
	"type" text NOT NULL,
	"step_id" uuid,
	"payload" jsonb DEFAULT '{}'::jsonb NOT NULL,
	"client_time" timestamp with time zone NOT NULL,
	"server_time" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "run_photos" (
	"id" uuid PRIMARY KEY NOT NULL,
	"run_id" uuid NOT NULL,
	"step_id" uuid,
	"content_type" text NOT NULL,
	"bytes" integer NOT NULL,
	"uploaded_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "runs" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"assignment_id" uuid NOT NULL,
	"student_id" uuid NOT NULL,
	"version_id" uuid NOT NULL,
	"status" "run_status" DEFAULT 'not_started' NOT NULL,
	"started_at" timestamp with time zone,
	"submitted_at" timestamp with time zone,
	"last_event_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "sign_offs" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"run_id" uuid NOT NULL,
	"instructor_id" uuid NOT NULL,
	"signed_at" timestamp with time zone DEFAULT now() NOT NULL,
	"version_id" uuid NOT NULL,
	"revisions_cited" jsonb NOT NULL,
	"actual_minutes" integer DEFAULT 0 NOT NULL,
	"comment" text DEFAULT '' NOT NULL,
	CONSTRAINT "sign_offs_run_id_unique" UNIQUE("run_id")
);
--> statement-breakpoint
ALTER TABLE "manuals" ADD COLUMN "keep_on_carts" boolean DEFAULT false NOT NULL;--> statement-breakpoint
ALTER TABLE "assignments" ADD CONSTRAINT "assignments_card_id_task_cards_id_fk" FOREIGN KEY ("card_id") REFERENCES "public"."task_cards"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "assignments" ADD CONSTRAINT "assignments_version_id_task_card_versions_id_fk" FOREIGN KEY ("version_id") REFERENCES "public"."task_card_versions"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "assignments" ADD CONSTRAINT "assignments_class_id_classes_id_fk" FOREIGN KEY ("class_id") REFERENCES "public"."classes"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "assignments" ADD CONSTRAINT "assignments_assigned_by_users_id_fk" FOREIGN KEY ("assigned_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "run_events" ADD CONSTRAINT "run_events_run_id_runs_id_fk" FOREIGN KEY ("run_id") REFERENCES "public"."runs"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "run_events" ADD CONSTRAINT "run_events_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "run_photos" ADD CONSTRAINT "run_photos_run_id_runs_id_fk" FOREIGN KEY ("run_id") REFERENCES "public"."runs"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "run_photos" ADD CONSTRAINT "run_photos_uploaded_by_users_id_fk" FOREIGN KEY ("uploaded_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "runs" ADD CONSTRAINT "runs_assignment_id_assignments_id_fk" FOREIGN KEY ("assignment_id") REFERENCES "public"."assignments"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "runs" ADD CONSTRAINT "runs_student_id_users_id_fk" FOREIGN KEY ("student_id") REFERENCES "public"."users"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "runs" ADD CONSTRAINT "runs_version_id_task_card_versions_id_fk" FOREIGN KEY ("version_id") REFERENCES "public"."task_card_versions"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sign_offs" ADD CONSTRAINT "sign_offs_run_id_runs_id_fk" FOREIGN KEY ("run_id") REFERENCES "public"."runs"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sign_offs" ADD CONSTRAINT "sign_offs_instructor_id_users_id_fk" FOREIGN KEY ("instructor_id") REFERENCES "public"."users"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sign_offs" ADD CONSTRAINT "sign_offs_version_id_task_card_versions_id_fk" FOREIGN KEY ("version_id") REFERENCES "public"."task_card_versions"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "assignments_version_idx" ON "assignments" USING btree ("version_id");--> statement-breakpoint
CREATE INDEX "run_events_run_idx" ON "run_events" USING btree ("run_id","client_time");--> statement-breakpoint
CREATE UNIQUE INDEX "runs_assignment_student_key" ON "runs" USING btree ("assignment_id","student_id");--> statement-breakpoint
CREATE INDEX "runs_student_idx" ON "runs" USING btree ("student_id","status");--> statement-breakpoint
CREATE INDEX "runs_status_idx" ON "runs" USING btree ("status");--> statement-breakpoint
-- A sign-off is the school's record: nothing may change or remove it, from any path.
CREATE FUNCTION hl_sign_off_immutable() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  RAISE EXCEPTION 'sign-off % is part of the record and cannot change', OLD.id USING ERRCODE = 'HLF02';
END $$;--> statement-breakpoint
CREATE TRIGGER sign_offs_immutable BEFORE UPDATE OR DELETE ON "sign_offs"
  FOR EACH ROW EXECUTE FUNCTION hl_sign_off_immutable();--> statement-breakpoint
-- Events are history: never changed, never removed; and none is added to a signed-off run.
CREATE FUNCTION hl_run_events_append_only() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  IF TG_OP <> 'INSERT' THEN
    RAISE EXCEPTION 'run event % cannot change', OLD.id USING ERRCODE = 'HLF02';
  END IF;
  IF EXISTS (SELECT 1 FROM sign_offs WHERE run_id = NEW.run_id) THEN
    RAISE EXCEPTION 'run % is signed off', NEW.run_id USING ERRCODE = 'HLF03';
  END IF;
  RETURN NEW;
END $$;--> statement-breakpoint
CREATE TRIGGER run_events_append_only BEFORE INSERT OR UPDATE OR DELETE ON "run_events"
  FOR EACH ROW EXECUTE FUNCTION hl_run_events_append_only();
