CREATE TABLE "design_revisions" (
	"id" serial PRIMARY KEY NOT NULL,
	"design_id" integer NOT NULL,
	"revision" integer NOT NULL,
	"status" varchar(12) DEFAULT 'draft' NOT NULL,
	"spec" jsonb NOT NULL,
	"construction" jsonb,
	"result" jsonb,
	"engine_version" varchar(20),
	"material_id" integer,
	"note" text,
	"created_by" integer,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"approved_by" integer,
	"released_at" timestamp with time zone,
	CONSTRAINT "design_revisions_status_check" CHECK ("design_revisions"."status" in ('draft', 'in_review', 'approved', 'released', 'superseded'))
);
--> statement-breakpoint
CREATE TABLE "designs" (
	"id" serial PRIMARY KEY NOT NULL,
	"number" varchar(20) NOT NULL,
	"title" varchar(120) NOT NULL,
	"owner_id" integer NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "designs_number_unique" UNIQUE("number")
);
--> statement-breakpoint
CREATE TABLE "material_imports" (
	"id" serial PRIMARY KEY NOT NULL,
	"file_name" varchar(200) NOT NULL,
	"uploaded_by" integer,
	"uploaded_at" timestamp with time zone DEFAULT now() NOT NULL,
	"row_count" integer NOT NULL,
	"created_count" integer NOT NULL,
	"versioned_count" integer NOT NULL,
	"skipped_count" integer NOT NULL
);
--> statement-breakpoint
CREATE TABLE "revision_transitions" (
	"id" serial PRIMARY KEY NOT NULL,
	"revision_id" integer NOT NULL,
	"from_status" varchar(12),
	"to_status" varchar(12) NOT NULL,
	"actor_id" integer,
	"comment" text,
	"at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "user_cores" (
	"id" serial PRIMARY KEY NOT NULL,
	"lineage" varchar(80) NOT NULL,
	"version" integer NOT NULL,
	"current" boolean DEFAULT true NOT NULL,
	"retired" boolean DEFAULT false NOT NULL,
	"name" varchar(80) NOT NULL,
	"family" varchar(20) NOT NULL,
	"shape" jsonb NOT NULL,
	"created_by" integer,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "materials" ADD COLUMN "import_id" integer;--> statement-breakpoint
ALTER TABLE "design_revisions" ADD CONSTRAINT "design_revisions_design_id_designs_id_fk" FOREIGN KEY ("design_id") REFERENCES "public"."designs"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "design_revisions" ADD CONSTRAINT "design_revisions_material_id_materials_id_fk" FOREIGN KEY ("material_id") REFERENCES "public"."materials"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "design_revisions" ADD CONSTRAINT "design_revisions_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "design_revisions" ADD CONSTRAINT "design_revisions_approved_by_users_id_fk" FOREIGN KEY ("approved_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "designs" ADD CONSTRAINT "designs_owner_id_users_id_fk" FOREIGN KEY ("owner_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "material_imports" ADD CONSTRAINT "material_imports_uploaded_by_users_id_fk" FOREIGN KEY ("uploaded_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "revision_transitions" ADD CONSTRAINT "revision_transitions_revision_id_design_revisions_id_fk" FOREIGN KEY ("revision_id") REFERENCES "public"."design_revisions"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "revision_transitions" ADD CONSTRAINT "revision_transitions_actor_id_users_id_fk" FOREIGN KEY ("actor_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "user_cores" ADD CONSTRAINT "user_cores_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "design_revisions_design_revision_idx" ON "design_revisions" USING btree ("design_id","revision");--> statement-breakpoint
CREATE UNIQUE INDEX "user_cores_lineage_version_idx" ON "user_cores" USING btree ("lineage","version");--> statement-breakpoint
ALTER TABLE "materials" ADD CONSTRAINT "materials_import_id_material_imports_id_fk" FOREIGN KEY ("import_id") REFERENCES "public"."material_imports"("id") ON DELETE set null ON UPDATE no action;