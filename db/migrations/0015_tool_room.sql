CREATE TABLE "tool_calibrations" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"tool_id" uuid NOT NULL,
	"calibrated_on" date NOT NULL,
	"calibrated_by" text NOT NULL,
	"certificate" text NOT NULL,
	"next_due_on" date NOT NULL,
	"recorded_by" uuid NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "tool_checkouts" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"kit_id" uuid,
	"tool_id" uuid,
	"user_id" uuid NOT NULL,
	"team_note" text DEFAULT '' NOT NULL,
	"run_id" uuid,
	"tool_ids" jsonb NOT NULL,
	"due_at" timestamp with time zone NOT NULL,
	"checked_out_at" timestamp with time zone DEFAULT now() NOT NULL,
	"checked_out_by" uuid NOT NULL,
	"returned_at" timestamp with time zone,
	"returned_by" uuid,
	"overdue_mailed_at" timestamp with time zone,
	CONSTRAINT "tool_checkouts_what" CHECK (("tool_checkouts"."kit_id" is null) <> ("tool_checkouts"."tool_id" is null))
);
--> statement-breakpoint
CREATE TABLE "tool_holds" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"checkout_id" uuid NOT NULL,
	"tool_id" uuid NOT NULL,
	"user_id" uuid NOT NULL,
	"run_id" uuid,
	"opened_at" timestamp with time zone DEFAULT now() NOT NULL,
	"opened_by" uuid NOT NULL,
	"cleared_at" timestamp with time zone,
	"cleared_by" uuid,
	"outcome" text,
	"note" text DEFAULT '' NOT NULL,
	CONSTRAINT "tool_holds_outcome" CHECK ("tool_holds"."outcome" is null or "tool_holds"."outcome" in ('found', 'lost')),
	CONSTRAINT "tool_holds_cleared" CHECK (("tool_holds"."cleared_at" is null) = ("tool_holds"."outcome" is null))
);
--> statement-breakpoint
CREATE TABLE "tool_kits" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"number" text NOT NULL,
	"name" text NOT NULL,
	"location" text DEFAULT '' NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "tools" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"number" text NOT NULL,
	"description" text NOT NULL,
	"kit_id" uuid,
	"calibrated" boolean DEFAULT false NOT NULL,
	"calibration_interval_days" integer,
	"calibration_due_on" date,
	"status" text DEFAULT 'in_service' NOT NULL,
	"out_of_service_reason" text DEFAULT '' NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "tools_status" CHECK ("tools"."status" in ('in_service', 'out_of_service')),
	CONSTRAINT "tools_interval" CHECK ("tools"."calibration_interval_days" is null or "tools"."calibration_interval_days" between 1 and 3660)
);
--> statement-breakpoint
ALTER TABLE "tool_calibrations" ADD CONSTRAINT "tool_calibrations_tool_id_tools_id_fk" FOREIGN KEY ("tool_id") REFERENCES "public"."tools"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "tool_calibrations" ADD CONSTRAINT "tool_calibrations_recorded_by_users_id_fk" FOREIGN KEY ("recorded_by") REFERENCES "public"."users"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "tool_checkouts" ADD CONSTRAINT "tool_checkouts_kit_id_tool_kits_id_fk" FOREIGN KEY ("kit_id") REFERENCES "public"."tool_kits"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "tool_checkouts" ADD CONSTRAINT "tool_checkouts_tool_id_tools_id_fk" FOREIGN KEY ("tool_id") REFERENCES "public"."tools"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "tool_checkouts" ADD CONSTRAINT "tool_checkouts_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "tool_checkouts" ADD CONSTRAINT "tool_checkouts_run_id_runs_id_fk" FOREIGN KEY ("run_id") REFERENCES "public"."runs"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "tool_checkouts" ADD CONSTRAINT "tool_checkouts_checked_out_by_users_id_fk" FOREIGN KEY ("checked_out_by") REFERENCES "public"."users"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "tool_checkouts" ADD CONSTRAINT "tool_checkouts_returned_by_users_id_fk" FOREIGN KEY ("returned_by") REFERENCES "public"."users"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "tool_holds" ADD CONSTRAINT "tool_holds_checkout_id_tool_checkouts_id_fk" FOREIGN KEY ("checkout_id") REFERENCES "public"."tool_checkouts"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "tool_holds" ADD CONSTRAINT "tool_holds_tool_id_tools_id_fk" FOREIGN KEY ("tool_id") REFERENCES "public"."tools"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "tool_holds" ADD CONSTRAINT "tool_holds_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "tool_holds" ADD CONSTRAINT "tool_holds_run_id_runs_id_fk" FOREIGN KEY ("run_id") REFERENCES "public"."runs"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "tool_holds" ADD CONSTRAINT "tool_holds_opened_by_users_id_fk" FOREIGN KEY ("opened_by") REFERENCES "public"."users"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "tool_holds" ADD CONSTRAINT "tool_holds_cleared_by_users_id_fk" FOREIGN KEY ("cleared_by") REFERENCES "public"."users"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "tools" ADD CONSTRAINT "tools_kit_id_tool_kits_id_fk" FOREIGN KEY ("kit_id") REFERENCES "public"."tool_kits"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "tool_calibrations_tool_idx" ON "tool_calibrations" USING btree ("tool_id","calibrated_on");--> statement-breakpoint
CREATE INDEX "tool_checkouts_user_idx" ON "tool_checkouts" USING btree ("user_id","returned_at");--> statement-breakpoint
CREATE INDEX "tool_checkouts_open_idx" ON "tool_checkouts" USING btree ("due_at") WHERE "tool_checkouts"."returned_at" is null;--> statement-breakpoint
CREATE INDEX "tool_holds_open_idx" ON "tool_holds" USING btree ("user_id") WHERE "tool_holds"."cleared_at" is null;--> statement-breakpoint
CREATE UNIQUE INDEX "tool_kits_number_key" ON "tool_kits" USING btree ("number");--> statement-breakpoint
CREATE UNIQUE INDEX "tools_number_key" ON "tools" USING btree ("number");--> statement-breakpoint
CREATE INDEX "tools_kit_idx" ON "tools" USING btree ("kit_id");--> statement-breakpoint
-- A calibration is the tool's certificate history: a mistake is corrected by a newer entry.
CREATE FUNCTION hl_tool_calibrations_immutable() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  RAISE EXCEPTION 'calibration % is part of the tool''s history and cannot change', OLD.id USING ERRCODE = 'HLF02';
END $$;--> statement-breakpoint
CREATE TRIGGER tool_calibrations_immutable BEFORE UPDATE OR DELETE ON "tool_calibrations"
  FOR EACH ROW EXECUTE FUNCTION hl_tool_calibrations_immutable();
