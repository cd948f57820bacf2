ALTER TABLE "bill" ADD COLUMN "created_import_id" uuid;--> statement-breakpoint
CREATE INDEX "bill_created_import_idx" ON "bill" USING btree ("created_import_id");