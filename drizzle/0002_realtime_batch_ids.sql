ALTER TABLE "sheet_ops" ADD COLUMN "batch_id" text;--> statement-breakpoint
CREATE UNIQUE INDEX "sheet_ops_project_batch_idx" ON "sheet_ops" USING btree ("project_id","batch_id");