CREATE TABLE "api_tokens" (
	"id" serial PRIMARY KEY NOT NULL,
	"user_id" integer NOT NULL,
	"name" text NOT NULL,
	"prefix" text NOT NULL,
	"token_hash" text NOT NULL,
	"last_used_at" timestamp with time zone,
	"revoked_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "api_tokens_token_hash_unique" UNIQUE("token_hash")
);
--> statement-breakpoint
CREATE TABLE "audit_log" (
	"id" serial PRIMARY KEY NOT NULL,
	"at" timestamp with time zone DEFAULT now() NOT NULL,
	"actor_id" integer,
	"actor_email" text,
	"action" text NOT NULL,
	"subject" text,
	"details" jsonb,
	"ip" text
);
--> statement-breakpoint
CREATE TABLE "bom_purchase_lines" (
	"id" serial PRIMARY KEY NOT NULL,
	"bom_id" integer NOT NULL,
	"line_key" text NOT NULL,
	"supplier" text,
	"quoted_unit_price" double precision,
	"order_reference" text,
	"updated_by" integer,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "boms" (
	"id" serial PRIMARY KEY NOT NULL,
	"design_id" integer NOT NULL,
	"revision" integer NOT NULL,
	"design_revision" integer NOT NULL,
	"status" text DEFAULT 'released' NOT NULL,
	"snapshot" jsonb NOT NULL,
	"changes" jsonb,
	"released_by" integer,
	"released_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "catalog_imports" (
	"id" serial PRIMARY KEY NOT NULL,
	"filename" text NOT NULL,
	"storage_key" text NOT NULL,
	"size_bytes" integer NOT NULL,
	"status" text NOT NULL,
	"sheet_name" text,
	"headers" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"mapping" jsonb,
	"decimal_separator" text DEFAULT '.' NOT NULL,
	"row_count" integer DEFAULT 0 NOT NULL,
	"issue_count" integer DEFAULT 0 NOT NULL,
	"catalog_version_id" integer,
	"uploaded_by" integer,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "catalog_versions" (
	"id" serial PRIMARY KEY NOT NULL,
	"number" integer NOT NULL,
	"import_id" integer,
	"note" text DEFAULT '' NOT NULL,
	"parts_added" integer DEFAULT 0 NOT NULL,
	"parts_updated" integer DEFAULT 0 NOT NULL,
	"created_by" integer,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "catalog_versions_number_unique" UNIQUE("number")
);
--> statement-breakpoint
CREATE TABLE "design_revisions" (
	"id" serial PRIMARY KEY NOT NULL,
	"design_id" integer NOT NULL,
	"revision" integer NOT NULL,
	"name" text NOT NULL,
	"input" jsonb NOT NULL,
	"author_id" integer,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "designs" (
	"id" serial PRIMARY KEY NOT NULL,
	"name" text NOT NULL,
	"description" text DEFAULT '' NOT NULL,
	"owner_id" integer,
	"status" text DEFAULT 'active' NOT NULL,
	"revision" integer DEFAULT 1 NOT NULL,
	"topology" text NOT NULL,
	"levels" integer NOT NULL,
	"dc_voltage" double precision,
	"power_kw" double precision,
	"back_to_back" boolean DEFAULT false NOT NULL,
	"input" jsonb NOT NULL,
	"bom_settings" jsonb DEFAULT '{"buildQuantity":10,"sparesPercent":5,"manualLines":[]}'::jsonb NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "header_mappings" (
	"id" serial PRIMARY KEY NOT NULL,
	"user_id" integer NOT NULL,
	"signature" text NOT NULL,
	"mapping" jsonb NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "one_time_tokens" (
	"id" serial PRIMARY KEY NOT NULL,
	"user_id" integer NOT NULL,
	"purpose" text NOT NULL,
	"token_hash" text NOT NULL,
	"expires_at" timestamp with time zone NOT NULL,
	"used_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "one_time_tokens_token_hash_unique" UNIQUE("token_hash")
);
--> statement-breakpoint
CREATE TABLE "part_assignments" (
	"id" serial PRIMARY KEY NOT NULL,
	"design_id" integer NOT NULL,
	"side" text NOT NULL,
	"position" text NOT NULL,
	"part_version_id" integer NOT NULL,
	"series_count" integer DEFAULT 1 NOT NULL,
	"parallel_count" integer DEFAULT 1 NOT NULL,
	"assigned_by" integer,
	"assigned_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "part_versions" (
	"id" serial PRIMARY KEY NOT NULL,
	"part_id" integer NOT NULL,
	"catalog_version_id" integer NOT NULL,
	"part_number" text NOT NULL,
	"manufacturer" text NOT NULL,
	"kind" text NOT NULL,
	"package_config" text NOT NULL,
	"voltage_rating" double precision,
	"current_rating" double precision,
	"unit_price" double precision,
	"currency" text,
	"stock" integer,
	"lead_time_days" integer,
	"lifecycle" text NOT NULL,
	"data" jsonb NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "parts" (
	"id" serial PRIMARY KEY NOT NULL,
	"manufacturer" text NOT NULL,
	"part_number" text NOT NULL,
	"current_version_id" integer,
	"approved" boolean DEFAULT false NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "sent_mail" (
	"id" serial PRIMARY KEY NOT NULL,
	"at" timestamp with time zone DEFAULT now() NOT NULL,
	"to" text NOT NULL,
	"subject" text NOT NULL,
	"message_id" text,
	"attachments" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"status" text NOT NULL,
	"error" text
);
--> statement-breakpoint
CREATE TABLE "users" (
	"id" serial PRIMARY KEY NOT NULL,
	"email" text NOT NULL,
	"name" text NOT NULL,
	"role" text NOT NULL,
	"password_hash" text,
	"disabled" boolean DEFAULT false NOT NULL,
	"session_version" integer DEFAULT 1 NOT NULL,
	"last_sign_in_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "api_tokens" ADD CONSTRAINT "api_tokens_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "audit_log" ADD CONSTRAINT "audit_log_actor_id_users_id_fk" FOREIGN KEY ("actor_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "bom_purchase_lines" ADD CONSTRAINT "bom_purchase_lines_bom_id_boms_id_fk" FOREIGN KEY ("bom_id") REFERENCES "public"."boms"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "bom_purchase_lines" ADD CONSTRAINT "bom_purchase_lines_updated_by_users_id_fk" FOREIGN KEY ("updated_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "boms" ADD CONSTRAINT "boms_design_id_designs_id_fk" FOREIGN KEY ("design_id") REFERENCES "public"."designs"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "boms" ADD CONSTRAINT "boms_released_by_users_id_fk" FOREIGN KEY ("released_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "catalog_imports" ADD CONSTRAINT "catalog_imports_catalog_version_id_catalog_versions_id_fk" FOREIGN KEY ("catalog_version_id") REFERENCES "public"."catalog_versions"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "catalog_imports" ADD CONSTRAINT "catalog_imports_uploaded_by_users_id_fk" FOREIGN KEY ("uploaded_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "catalog_versions" ADD CONSTRAINT "catalog_versions_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "design_revisions" ADD CONSTRAINT "design_revisions_design_id_designs_id_fk" FOREIGN KEY ("design_id") REFERENCES "public"."designs"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "design_revisions" ADD CONSTRAINT "design_revisions_author_id_users_id_fk" FOREIGN KEY ("author_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "designs" ADD CONSTRAINT "designs_owner_id_users_id_fk" FOREIGN KEY ("owner_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "header_mappings" ADD CONSTRAINT "header_mappings_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "one_time_tokens" ADD CONSTRAINT "one_time_tokens_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "part_assignments" ADD CONSTRAINT "part_assignments_design_id_designs_id_fk" FOREIGN KEY ("design_id") REFERENCES "public"."designs"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "part_assignments" ADD CONSTRAINT "part_assignments_part_version_id_part_versions_id_fk" FOREIGN KEY ("part_version_id") REFERENCES "public"."part_versions"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "part_assignments" ADD CONSTRAINT "part_assignments_assigned_by_users_id_fk" FOREIGN KEY ("assigned_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "part_versions" ADD CONSTRAINT "part_versions_part_id_parts_id_fk" FOREIGN KEY ("part_id") REFERENCES "public"."parts"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "part_versions" ADD CONSTRAINT "part_versions_catalog_version_id_catalog_versions_id_fk" FOREIGN KEY ("catalog_version_id") REFERENCES "public"."catalog_versions"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "audit_log_at_idx" ON "audit_log" USING btree ("at");--> statement-breakpoint
CREATE UNIQUE INDEX "bom_purchase_lines_key" ON "bom_purchase_lines" USING btree ("bom_id","line_key");--> statement-breakpoint
CREATE UNIQUE INDEX "boms_key" ON "boms" USING btree ("design_id","revision");--> statement-breakpoint
CREATE UNIQUE INDEX "design_revisions_key" ON "design_revisions" USING btree ("design_id","revision");--> statement-breakpoint
CREATE UNIQUE INDEX "header_mappings_key" ON "header_mappings" USING btree ("user_id","signature");--> statement-breakpoint
CREATE UNIQUE INDEX "part_assignments_key" ON "part_assignments" USING btree ("design_id","side","position");--> statement-breakpoint
CREATE INDEX "part_versions_part_idx" ON "part_versions" USING btree ("part_id");--> statement-breakpoint
CREATE INDEX "part_versions_kind_voltage_idx" ON "part_versions" USING btree ("kind","voltage_rating");--> statement-breakpoint
CREATE UNIQUE INDEX "parts_key" ON "parts" USING btree (lower("manufacturer"),lower("part_number"));--> statement-breakpoint
CREATE UNIQUE INDEX "users_email_key" ON "users" USING btree (lower("email"));