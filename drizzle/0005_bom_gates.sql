CREATE TABLE "bom_acknowledgements" (
	"id" serial PRIMARY KEY NOT NULL,
	"design_id" integer NOT NULL,
	"line_key" text NOT NULL,
	"part_version_id" integer NOT NULL,
	"reason" text NOT NULL,
	"acknowledged_by" integer,
	"acknowledged_by_name" text DEFAULT '' NOT NULL,
	"acknowledged_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "mail_outbox" (
	"id" serial PRIMARY KEY NOT NULL,
	"kind" text NOT NULL,
	"to" text NOT NULL,
	"subject" text NOT NULL,
	"payload" jsonb NOT NULL,
	"status" text DEFAULT 'pending' NOT NULL,
	"attempts" integer DEFAULT 0 NOT NULL,
	"next_attempt_at" timestamp with time zone DEFAULT now() NOT NULL,
	"last_error" text,
	"sent_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "bom_purchase_lines" ADD COLUMN "status" text DEFAULT 'to-quote' NOT NULL;--> statement-breakpoint
ALTER TABLE "bom_purchase_lines" ADD COLUMN "status_dates" jsonb DEFAULT '{}'::jsonb NOT NULL;--> statement-breakpoint
ALTER TABLE "bom_purchase_lines" ADD COLUMN "quote_currency" text;--> statement-breakpoint
ALTER TABLE "bom_purchase_lines" ADD COLUMN "promised_delivery" text;--> statement-breakpoint
ALTER TABLE "part_assignments" ADD COLUMN "design_revision" integer DEFAULT 1 NOT NULL;--> statement-breakpoint
ALTER TABLE "part_assignments" ADD COLUMN "confirmed_revision" integer;--> statement-breakpoint
ALTER TABLE "part_assignments" ADD COLUMN "confirmed_reason" text;--> statement-breakpoint
ALTER TABLE "part_assignments" ADD COLUMN "covered_by" text;--> statement-breakpoint
ALTER TABLE "bom_acknowledgements" ADD CONSTRAINT "bom_acknowledgements_design_id_designs_id_fk" FOREIGN KEY ("design_id") REFERENCES "public"."designs"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "bom_acknowledgements" ADD CONSTRAINT "bom_acknowledgements_acknowledged_by_users_id_fk" FOREIGN KEY ("acknowledged_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "bom_acknowledgements_key" ON "bom_acknowledgements" USING btree ("design_id","line_key");--> statement-breakpoint
CREATE INDEX "mail_outbox_due_idx" ON "mail_outbox" USING btree ("status","next_attempt_at");