-- Trigram search for the parts browser (pg_trgm ships with PostgreSQL's contrib; trusted, so the database owner may create it).
CREATE EXTENSION IF NOT EXISTS pg_trgm;--> statement-breakpoint
ALTER TABLE "catalog_imports" ADD COLUMN "settings" jsonb DEFAULT '{}'::jsonb NOT NULL;--> statement-breakpoint
ALTER TABLE "catalog_imports" ADD COLUMN "refused_count" integer DEFAULT 0 NOT NULL;--> statement-breakpoint
ALTER TABLE "catalog_versions" ADD COLUMN "parts_total" integer DEFAULT 0 NOT NULL;--> statement-breakpoint
ALTER TABLE "header_mappings" ADD COLUMN "settings" jsonb DEFAULT '{}'::jsonb NOT NULL;--> statement-breakpoint
ALTER TABLE "part_versions" ADD COLUMN "is_current" boolean DEFAULT false NOT NULL;--> statement-breakpoint
UPDATE "part_versions" SET "is_current" = true FROM "parts" WHERE "parts"."current_version_id" = "part_versions"."id";--> statement-breakpoint
UPDATE "catalog_versions" SET "parts_total" = (SELECT count(*) FROM "parts" WHERE "current_version_id" IS NOT NULL) WHERE "number" = (SELECT max("number") FROM "catalog_versions");--> statement-breakpoint
CREATE INDEX "part_versions_current_partNumber_idx" ON "part_versions" USING btree ("part_number","part_id") WHERE "part_versions"."is_current";--> statement-breakpoint
CREATE INDEX "part_versions_current_manufacturer_idx" ON "part_versions" USING btree ("manufacturer","part_id") WHERE "part_versions"."is_current";--> statement-breakpoint
CREATE INDEX "part_versions_current_kind_idx" ON "part_versions" USING btree ("kind","part_id") WHERE "part_versions"."is_current";--> statement-breakpoint
CREATE INDEX "part_versions_current_voltageRating_idx" ON "part_versions" USING btree ("voltage_rating","part_id") WHERE "part_versions"."is_current";--> statement-breakpoint
CREATE INDEX "part_versions_current_currentRating_idx" ON "part_versions" USING btree ("current_rating","part_id") WHERE "part_versions"."is_current";--> statement-breakpoint
CREATE INDEX "part_versions_current_unitPrice_idx" ON "part_versions" USING btree ("unit_price","part_id") WHERE "part_versions"."is_current";--> statement-breakpoint
CREATE INDEX "part_versions_current_stock_idx" ON "part_versions" USING btree ("stock","part_id") WHERE "part_versions"."is_current";--> statement-breakpoint
CREATE INDEX "part_versions_current_leadTimeDays_idx" ON "part_versions" USING btree ("lead_time_days","part_id") WHERE "part_versions"."is_current";--> statement-breakpoint
CREATE INDEX "part_versions_current_lifecycle_idx" ON "part_versions" USING btree ("lifecycle","part_id") WHERE "part_versions"."is_current";--> statement-breakpoint
CREATE INDEX "part_versions_current_part_idx" ON "part_versions" USING btree ("part_id") WHERE "part_versions"."is_current";--> statement-breakpoint
CREATE INDEX "part_versions_current_pn_trgm" ON "part_versions" USING gin ("part_number" gin_trgm_ops) WHERE "part_versions"."is_current";--> statement-breakpoint
CREATE INDEX "part_versions_current_mfr_trgm" ON "part_versions" USING gin ("manufacturer" gin_trgm_ops) WHERE "part_versions"."is_current";--> statement-breakpoint
CREATE INDEX "part_versions_current_desc_trgm" ON "part_versions" USING gin (("data"->>'description') gin_trgm_ops) WHERE "part_versions"."is_current";