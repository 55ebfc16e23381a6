CREATE TABLE "catalog_state" (
	"id" integer PRIMARY KEY NOT NULL,
	"generation" integer DEFAULT 0 NOT NULL
);
