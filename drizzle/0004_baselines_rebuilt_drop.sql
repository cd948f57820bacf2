DROP TABLE "baseline" CASCADE;--> statement-breakpoint
DROP TABLE "baseline_decision" CASCADE;