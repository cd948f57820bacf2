CREATE TABLE "measure" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"finding_id" uuid NOT NULL,
	"walkthrough_id" uuid NOT NULL,
	"installation_id" uuid NOT NULL,
	"building_id" uuid NOT NULL,
	"title" text NOT NULL,
	"status" text DEFAULT 'proposed' NOT NULL,
	"savings" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"annual_energy_cost_savings" double precision DEFAULT 0 NOT NULL,
	"annual_water_cost_savings" double precision DEFAULT 0 NOT NULL,
	"annual_om_cost_savings" double precision DEFAULT 0 NOT NULL,
	"installed_cost" double precision NOT NULL,
	"incentives" double precision DEFAULT 0 NOT NULL,
	"life_years" integer NOT NULL,
	"economics" jsonb DEFAULT '{}'::jsonb NOT NULL,
	"approved_by" text,
	"approved_at" timestamp with time zone,
	"implemented_on" date,
	"created_by" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "measure_finding_id_unique" UNIQUE("finding_id")
);
--> statement-breakpoint
ALTER TABLE "finding" ALTER COLUMN "status" SET DEFAULT 'open';--> statement-breakpoint
ALTER TABLE "instrument" ADD COLUMN "calibration_notice_on" date;--> statement-breakpoint
ALTER TABLE "loan" ADD COLUMN "overdue_notice_on" date;--> statement-breakpoint
ALTER TABLE "photo" ADD COLUMN "finding_id" uuid;--> statement-breakpoint
ALTER TABLE "walkthrough" ADD COLUMN "title" text DEFAULT '' NOT NULL;--> statement-breakpoint
ALTER TABLE "measure" ADD CONSTRAINT "measure_finding_id_finding_id_fk" FOREIGN KEY ("finding_id") REFERENCES "public"."finding"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "measure" ADD CONSTRAINT "measure_walkthrough_id_walkthrough_id_fk" FOREIGN KEY ("walkthrough_id") REFERENCES "public"."walkthrough"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "measure" ADD CONSTRAINT "measure_installation_id_installation_id_fk" FOREIGN KEY ("installation_id") REFERENCES "public"."installation"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "measure" ADD CONSTRAINT "measure_building_id_building_id_fk" FOREIGN KEY ("building_id") REFERENCES "public"."building"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "measure_walkthrough_idx" ON "measure" USING btree ("walkthrough_id");--> statement-breakpoint
CREATE INDEX "measure_building_idx" ON "measure" USING btree ("building_id","status");--> statement-breakpoint
ALTER TABLE "loan" ADD CONSTRAINT "loan_walkthrough_id_walkthrough_id_fk" FOREIGN KEY ("walkthrough_id") REFERENCES "public"."walkthrough"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "photo" ADD CONSTRAINT "photo_finding_id_finding_id_fk" FOREIGN KEY ("finding_id") REFERENCES "public"."finding"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "finding" DROP COLUMN "savings";--> statement-breakpoint
ALTER TABLE "finding" DROP COLUMN "annual_cost_savings";--> statement-breakpoint
ALTER TABLE "finding" DROP COLUMN "installed_cost";--> statement-breakpoint
ALTER TABLE "finding" DROP COLUMN "life_years";--> statement-breakpoint
ALTER TABLE "finding" DROP COLUMN "implemented_on";--> statement-breakpoint
ALTER TABLE "loan" ADD CONSTRAINT "loan_dates_ordered" CHECK ("loan"."end_date" >= "loan"."start_date");