ALTER TABLE "catalog_imports" ADD COLUMN "settings" jsonb DEFAULT '{}'::jsonb NOT NULL;--> statement-breakpoint
ALTER TABLE "catalog_imports" ADD COLUMN "refused_count" integer DEFAULT 0 NOT NULL;--> statement-breakpoint
ALTER TABLE "header_mappings" ADD COLUMN "settings" jsonb DEFAULT '{}'::jsonb NOT NULL;