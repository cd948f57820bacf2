CREATE TABLE "baseline" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"meter_id" uuid NOT NULL,
	"building_id" uuid NOT NULL,
	"installation_id" uuid NOT NULL,
	"commodity" text NOT NULL,
	"unit" text DEFAULT '' NOT NULL,
	"period_start" date,
	"period_end" date,
	"period_chosen" boolean DEFAULT false NOT NULL,
	"status" text NOT NULL,
	"shape" text,
	"override_shape" text,
	"reason" text,
	"r2" double precision,
	"adj_r2" double precision,
	"cvrmse" double precision,
	"nac" double precision,
	"nac_converted" double precision,
	"fit" jsonb DEFAULT '{}'::jsonb NOT NULL,
	"input_hash" text DEFAULT '' NOT NULL,
	"fitted_at" timestamp with time zone DEFAULT now() NOT NULL,
	"reviewed_by" text,
	"reviewed_at" timestamp with time zone,
	"note" text DEFAULT '' NOT NULL
);
--> statement-breakpoint
CREATE TABLE "baseline_decision" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"baseline_id" uuid NOT NULL,
	"user_id" text,
	"actor" text DEFAULT '' NOT NULL,
	"action" text NOT NULL,
	"shape" text,
	"note" text NOT NULL,
	"details" jsonb DEFAULT '{}'::jsonb NOT NULL,
	"at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "baseline" ADD CONSTRAINT "baseline_meter_id_meter_id_fk" FOREIGN KEY ("meter_id") REFERENCES "public"."meter"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "baseline" ADD CONSTRAINT "baseline_building_id_building_id_fk" FOREIGN KEY ("building_id") REFERENCES "public"."building"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "baseline" ADD CONSTRAINT "baseline_installation_id_installation_id_fk" FOREIGN KEY ("installation_id") REFERENCES "public"."installation"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "baseline_decision" ADD CONSTRAINT "baseline_decision_baseline_id_baseline_id_fk" FOREIGN KEY ("baseline_id") REFERENCES "public"."baseline"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "baseline_meter_uq" ON "baseline" USING btree ("meter_id");--> statement-breakpoint
CREATE INDEX "baseline_building_idx" ON "baseline" USING btree ("building_id","commodity");--> statement-breakpoint
CREATE INDEX "baseline_installation_idx" ON "baseline" USING btree ("installation_id","status");