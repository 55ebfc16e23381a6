-- Custom migration: every committed change to parts or part_versions moves catalog_state.generation on,
-- whatever route or service wrote it, so every instance can tell that its part cache is stale.
INSERT INTO "catalog_state" ("id", "generation") VALUES (1, 0) ON CONFLICT ("id") DO NOTHING;
--> statement-breakpoint
CREATE OR REPLACE FUNCTION stratavolt_bump_catalog_generation() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  UPDATE "catalog_state" SET "generation" = "generation" + 1 WHERE "id" = 1;
  RETURN NULL;
END
$$;
--> statement-breakpoint
CREATE TRIGGER "parts_catalog_generation" AFTER INSERT OR UPDATE OR DELETE OR TRUNCATE ON "parts"
  FOR EACH STATEMENT EXECUTE FUNCTION stratavolt_bump_catalog_generation();
--> statement-breakpoint
CREATE TRIGGER "part_versions_catalog_generation" AFTER INSERT OR UPDATE OR DELETE OR TRUNCATE ON "part_versions"
  FOR EACH STATEMENT EXECUTE FUNCTION stratavolt_bump_catalog_generation();
