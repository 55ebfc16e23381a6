CREATE TABLE "computed_answers" (
	"key" text PRIMARY KEY NOT NULL,
	"kind" text NOT NULL,
	"design_id" integer NOT NULL,
	"body" "bytea" NOT NULL,
	"gzip" boolean NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "computed_answers" ADD CONSTRAINT "computed_answers_design_id_designs_id_fk" FOREIGN KEY ("design_id") REFERENCES "public"."designs"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "computed_answers_design_idx" ON "computed_answers" USING btree ("design_id","kind","created_at");