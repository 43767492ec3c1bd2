CREATE TABLE "asset_installations" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"asset_id" uuid NOT NULL,
	"parent_id" uuid NOT NULL,
	"position" text DEFAULT '' NOT NULL,
	"installed_at" timestamp with time zone DEFAULT now() NOT NULL,
	"installed_by" uuid,
	"installed_run_id" uuid,
	"removed_at" timestamp with time zone,
	"removed_by" uuid,
	"removed_run_id" uuid,
	CONSTRAINT "asset_installations_not_self" CHECK ("asset_installations"."asset_id" <> "asset_installations"."parent_id")
);
--> statement-breakpoint
CREATE TABLE "assets" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"identifier" text NOT NULL,
	"kind" text NOT NULL,
	"model" text NOT NULL,
	"serial" text DEFAULT '' NOT NULL,
	"status" text DEFAULT 'instructional' NOT NULL,
	"status_reason" text DEFAULT '' NOT NULL,
	"location" text DEFAULT '' NOT NULL,
	"span_metres" real,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "assets_kind" CHECK ("assets"."kind" in ('aircraft', 'engine', 'propeller', 'component')),
	CONSTRAINT "assets_status" CHECK ("assets"."status" in ('airworthy', 'instructional', 'ground_run', 'out_of_service'))
);
--> statement-breakpoint
CREATE TABLE "bookings" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"asset_id" uuid NOT NULL,
	"place_id" uuid NOT NULL,
	"class_id" uuid,
	"purpose" text DEFAULT 'session' NOT NULL,
	"note" text DEFAULT '' NOT NULL,
	"starts_at" timestamp with time zone NOT NULL,
	"ends_at" timestamp with time zone NOT NULL,
	"created_by" uuid NOT NULL,
	"cancelled_at" timestamp with time zone,
	"cancelled_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "bookings_purpose" CHECK ("bookings"."purpose" in ('session', 'move_in', 'move_out')),
	CONSTRAINT "bookings_order" CHECK ("bookings"."ends_at" > "bookings"."starts_at")
);
--> statement-breakpoint
CREATE TABLE "findings" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"asset_id" uuid NOT NULL,
	"run_id" uuid,
	"step_id" uuid,
	"text" text NOT NULL,
	"photo_key" text,
	"reported_by" uuid NOT NULL,
	"found_at" timestamp with time zone NOT NULL,
	"received_at" timestamp with time zone DEFAULT now() NOT NULL,
	"decision" text,
	"decision_note" text DEFAULT '' NOT NULL,
	"new_assignment_id" uuid,
	"closed_by" uuid,
	"closed_at" timestamp with time zone,
	CONSTRAINT "findings_decision" CHECK ("findings"."decision" is null or "findings"."decision" in ('fixed_in_run', 'new_card', 'deferred', 'out_of_service'))
);
--> statement-breakpoint
CREATE TABLE "places" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"name" text NOT NULL,
	"kind" text NOT NULL,
	"takes" text[] DEFAULT '{}'::text[] NOT NULL,
	"max_span_metres" real,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "places_kind" CHECK ("places"."kind" in ('bay', 'engine_stand', 'ndt_room', 'tie_down'))
);
--> statement-breakpoint
CREATE TABLE "run_asset_changes" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"run_id" uuid NOT NULL,
	"action" text NOT NULL,
	"asset_id" uuid NOT NULL,
	"parent_id" uuid NOT NULL,
	"position" text DEFAULT '' NOT NULL,
	"applied_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "run_asset_changes_action" CHECK ("run_asset_changes"."action" in ('install', 'remove'))
);
--> statement-breakpoint
CREATE TABLE "run_assets" (
	"run_id" uuid NOT NULL,
	"asset_id" uuid NOT NULL,
	"named_by" uuid NOT NULL,
	"named_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "run_assets_run_id_asset_id_pk" PRIMARY KEY("run_id","asset_id")
);
--> statement-breakpoint
ALTER TABLE "asset_installations" ADD CONSTRAINT "asset_installations_asset_id_assets_id_fk" FOREIGN KEY ("asset_id") REFERENCES "public"."assets"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "asset_installations" ADD CONSTRAINT "asset_installations_parent_id_assets_id_fk" FOREIGN KEY ("parent_id") REFERENCES "public"."assets"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "asset_installations" ADD CONSTRAINT "asset_installations_installed_by_users_id_fk" FOREIGN KEY ("installed_by") REFERENCES "public"."users"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "asset_installations" ADD CONSTRAINT "asset_installations_installed_run_id_runs_id_fk" FOREIGN KEY ("installed_run_id") REFERENCES "public"."runs"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "asset_installations" ADD CONSTRAINT "asset_installations_removed_by_users_id_fk" FOREIGN KEY ("removed_by") REFERENCES "public"."users"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "asset_installations" ADD CONSTRAINT "asset_installations_removed_run_id_runs_id_fk" FOREIGN KEY ("removed_run_id") REFERENCES "public"."runs"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "bookings" ADD CONSTRAINT "bookings_asset_id_assets_id_fk" FOREIGN KEY ("asset_id") REFERENCES "public"."assets"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "bookings" ADD CONSTRAINT "bookings_place_id_places_id_fk" FOREIGN KEY ("place_id") REFERENCES "public"."places"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "bookings" ADD CONSTRAINT "bookings_class_id_classes_id_fk" FOREIGN KEY ("class_id") REFERENCES "public"."classes"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "bookings" ADD CONSTRAINT "bookings_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "bookings" ADD CONSTRAINT "bookings_cancelled_by_users_id_fk" FOREIGN KEY ("cancelled_by") REFERENCES "public"."users"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "findings" ADD CONSTRAINT "findings_asset_id_assets_id_fk" FOREIGN KEY ("asset_id") REFERENCES "public"."assets"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "findings" ADD CONSTRAINT "findings_run_id_runs_id_fk" FOREIGN KEY ("run_id") REFERENCES "public"."runs"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "findings" ADD CONSTRAINT "findings_reported_by_users_id_fk" FOREIGN KEY ("reported_by") REFERENCES "public"."users"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "findings" ADD CONSTRAINT "findings_new_assignment_id_assignments_id_fk" FOREIGN KEY ("new_assignment_id") REFERENCES "public"."assignments"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "findings" ADD CONSTRAINT "findings_closed_by_users_id_fk" FOREIGN KEY ("closed_by") REFERENCES "public"."users"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "run_asset_changes" ADD CONSTRAINT "run_asset_changes_run_id_runs_id_fk" FOREIGN KEY ("run_id") REFERENCES "public"."runs"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "run_asset_changes" ADD CONSTRAINT "run_asset_changes_asset_id_assets_id_fk" FOREIGN KEY ("asset_id") REFERENCES "public"."assets"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "run_asset_changes" ADD CONSTRAINT "run_asset_changes_parent_id_assets_id_fk" FOREIGN KEY ("parent_id") REFERENCES "public"."assets"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "run_assets" ADD CONSTRAINT "run_assets_run_id_runs_id_fk" FOREIGN KEY ("run_id") REFERENCES "public"."runs"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "run_assets" ADD CONSTRAINT "run_assets_asset_id_assets_id_fk" FOREIGN KEY ("asset_id") REFERENCES "public"."assets"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "run_assets" ADD CONSTRAINT "run_assets_named_by_users_id_fk" FOREIGN KEY ("named_by") REFERENCES "public"."users"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "asset_installations_current_key" ON "asset_installations" USING btree ("asset_id") WHERE "asset_installations"."removed_at" is null;--> statement-breakpoint
CREATE INDEX "asset_installations_parent_idx" ON "asset_installations" USING btree ("parent_id");--> statement-breakpoint
CREATE UNIQUE INDEX "assets_identifier_key" ON "assets" USING btree (lower("identifier"));--> statement-breakpoint
CREATE INDEX "bookings_asset_idx" ON "bookings" USING btree ("asset_id","starts_at");--> statement-breakpoint
CREATE INDEX "bookings_place_idx" ON "bookings" USING btree ("place_id","starts_at");--> statement-breakpoint
CREATE INDEX "findings_asset_idx" ON "findings" USING btree ("asset_id","closed_at");--> statement-breakpoint
CREATE INDEX "findings_open_idx" ON "findings" USING btree ("received_at") WHERE "findings"."closed_at" is null;--> statement-breakpoint
CREATE UNIQUE INDEX "places_name_key" ON "places" USING btree (lower("name"));--> statement-breakpoint
CREATE UNIQUE INDEX "run_asset_changes_key" ON "run_asset_changes" USING btree ("run_id","asset_id","action");--> statement-breakpoint
CREATE INDEX "run_assets_asset_idx" ON "run_assets" USING btree ("asset_id");--> statement-breakpoint
-- An installation is the asset's history: only its removal is written, once; nothing is deleted.
CREATE FUNCTION hl_asset_installations_history() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  IF TG_OP = 'DELETE' THEN
    RAISE EXCEPTION 'installation % is part of the asset''s history and cannot be deleted', OLD.id USING ERRCODE = 'HLF02';
  END IF;
  IF OLD.removed_at IS NOT NULL
     OR NEW.asset_id <> OLD.asset_id OR NEW.parent_id <> OLD.parent_id OR NEW.position <> OLD.position
     OR NEW.installed_at <> OLD.installed_at OR NEW.installed_by IS DISTINCT FROM OLD.installed_by
     OR NEW.installed_run_id IS DISTINCT FROM OLD.installed_run_id THEN
    RAISE EXCEPTION 'installation % is part of the asset''s history: only its removal is written, once', OLD.id USING ERRCODE = 'HLF02';
  END IF;
  RETURN NEW;
END $$;--> statement-breakpoint
CREATE TRIGGER asset_installations_history BEFORE UPDATE OR DELETE ON "asset_installations"
  FOR EACH ROW EXECUTE FUNCTION hl_asset_installations_history();
