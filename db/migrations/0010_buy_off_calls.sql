ALTER TABLE "runs" ADD COLUMN "waiting_step_id" uuid;--> statement-breakpoint
ALTER TABLE "runs" ADD COLUMN "called_at" timestamp with time zone;