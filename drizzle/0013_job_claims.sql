CREATE TABLE "job_claim" (
	"key" text PRIMARY KEY NOT NULL,
	"instance" text NOT NULL,
	"claimed_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "job_run" ADD COLUMN "slot" timestamp with time zone;