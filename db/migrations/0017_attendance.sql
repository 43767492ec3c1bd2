CREATE TABLE "attendance_entries" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"session_id" uuid NOT NULL,
	"user_id" uuid NOT NULL,
	"status" text NOT NULL,
	"minutes" integer NOT NULL,
	"makeup" text DEFAULT '' NOT NULL,
	"makeup_run_id" uuid,
	"correction_reason" text DEFAULT '' NOT NULL,
	"recorded_by" uuid NOT NULL,
	"recorded_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "attendance_entries_status" CHECK ("attendance_entries"."status" in ('present', 'late', 'absent', 'excused')),
	CONSTRAINT "attendance_entries_minutes" CHECK ("attendance_entries"."minutes" between 0 and 720)
);
--> statement-breakpoint
CREATE TABLE "class_sessions" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"class_id" uuid NOT NULL,
	"starts_at" timestamp with time zone NOT NULL,
	"minutes" integer NOT NULL,
	"section" text NOT NULL,
	"subject" text NOT NULL,
	"created_by" uuid NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"closed_at" timestamp with time zone,
	"closed_by" uuid,
	CONSTRAINT "class_sessions_minutes" CHECK ("class_sessions"."minutes" between 1 and 720),
	CONSTRAINT "class_sessions_section" CHECK ("class_sessions"."section" in ('General', 'Airframe', 'Powerplant'))
);
--> statement-breakpoint
ALTER TABLE "attendance_entries" ADD CONSTRAINT "attendance_entries_session_id_class_sessions_id_fk" FOREIGN KEY ("session_id") REFERENCES "public"."class_sessions"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "attendance_entries" ADD CONSTRAINT "attendance_entries_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "attendance_entries" ADD CONSTRAINT "attendance_entries_makeup_run_id_runs_id_fk" FOREIGN KEY ("makeup_run_id") REFERENCES "public"."runs"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "attendance_entries" ADD CONSTRAINT "attendance_entries_recorded_by_users_id_fk" FOREIGN KEY ("recorded_by") REFERENCES "public"."users"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "class_sessions" ADD CONSTRAINT "class_sessions_class_id_classes_id_fk" FOREIGN KEY ("class_id") REFERENCES "public"."classes"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "class_sessions" ADD CONSTRAINT "class_sessions_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "class_sessions" ADD CONSTRAINT "class_sessions_closed_by_users_id_fk" FOREIGN KEY ("closed_by") REFERENCES "public"."users"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "attendance_entries_session_idx" ON "attendance_entries" USING btree ("session_id","user_id","recorded_at");--> statement-breakpoint
CREATE INDEX "attendance_entries_user_idx" ON "attendance_entries" USING btree ("user_id");--> statement-breakpoint
CREATE INDEX "class_sessions_class_idx" ON "class_sessions" USING btree ("class_id","starts_at");--> statement-breakpoint
-- An attendance register is a school record: entries are never changed or removed; a correction is a new entry.
CREATE FUNCTION hl_attendance_append_only() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  RAISE EXCEPTION 'attendance entry % is part of the record and cannot change', OLD.id USING ERRCODE = 'HLF02';
END $$;--> statement-breakpoint
CREATE TRIGGER attendance_entries_append_only BEFORE UPDATE OR DELETE ON "attendance_entries"
  FOR EACH ROW EXECUTE FUNCTION hl_attendance_append_only();
