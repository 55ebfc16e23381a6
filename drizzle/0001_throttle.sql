CREATE TABLE "throttle_counters" (
	"key" text PRIMARY KEY NOT NULL,
	"hits" integer NOT NULL,
	"reset_at" timestamp with time zone NOT NULL
);
--> statement-breakpoint
CREATE INDEX "throttle_counters_reset_idx" ON "throttle_counters" USING btree ("reset_at");