CREATE TABLE "revoked_sessions" (
	"session_id" text PRIMARY KEY NOT NULL,
	"user_id" integer,
	"revoked_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "throttle_counters" (
	"key" text PRIMARY KEY NOT NULL,
	"hits" integer NOT NULL,
	"reset_at" timestamp with time zone NOT NULL
);
--> statement-breakpoint
ALTER TABLE "revoked_sessions" ADD CONSTRAINT "revoked_sessions_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "revoked_sessions_at_idx" ON "revoked_sessions" USING btree ("revoked_at");--> statement-breakpoint
CREATE INDEX "throttle_counters_reset_idx" ON "throttle_counters" USING btree ("reset_at");