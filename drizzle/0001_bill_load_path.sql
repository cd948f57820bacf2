ALTER TABLE "bill" DROP CONSTRAINT "bill_installation_id_installation_id_fk";
--> statement-breakpoint
DROP INDEX "bill_installation_idx";--> statement-breakpoint
DROP INDEX "bill_import_idx";--> statement-breakpoint
ALTER TABLE "bill" DROP COLUMN "installation_id";