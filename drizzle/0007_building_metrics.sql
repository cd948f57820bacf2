CREATE TABLE "building_metric" (
	"building_id" uuid PRIMARY KEY NOT NULL,
	"installation_id" uuid NOT NULL,
	"window_start" date NOT NULL,
	"window_end" date NOT NULL,
	"area_ft2" double precision NOT NULL,
	"site_kbtu" double precision,
	"site_eui" double precision,
	"source_eui" double precision,
	"ghg_kg_per_ft2" double precision,
	"eui_normalized" double precision,
	"eui_normalized_uncertainty" double precision,
	"normalized_provisional" boolean DEFAULT false NOT NULL,
	"water_gal" double precision,
	"wui" double precision,
	"cost_usd" double precision,
	"cost_intensity" double precision,
	"price_per_kbtu" double precision,
	"coverage" double precision,
	"yoy_current_kbtu" double precision,
	"yoy_previous_kbtu" double precision,
	"anomaly_periods" integer,
	"anomaly_beyond" integer,
	"commodities" jsonb DEFAULT '{}'::jsonb NOT NULL,
	"years" jsonb DEFAULT '{}'::jsonb NOT NULL,
	"computed_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "meter" ADD COLUMN "last_bill_end" date;--> statement-breakpoint
ALTER TABLE "building_metric" ADD CONSTRAINT "building_metric_building_id_building_id_fk" FOREIGN KEY ("building_id") REFERENCES "public"."building"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "building_metric" ADD CONSTRAINT "building_metric_installation_id_installation_id_fk" FOREIGN KEY ("installation_id") REFERENCES "public"."installation"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "building_metric_installation_idx" ON "building_metric" USING btree ("installation_id");