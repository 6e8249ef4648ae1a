CREATE TABLE "materials" (
	"id" serial PRIMARY KEY NOT NULL,
	"lineage" varchar(80) NOT NULL,
	"version" integer NOT NULL,
	"current" boolean DEFAULT true NOT NULL,
	"retired" boolean DEFAULT false NOT NULL,
	"name" varchar(80) NOT NULL,
	"family" varchar(20) NOT NULL,
	"unit_set" varchar(20) NOT NULL,
	"k_uploaded" double precision NOT NULL,
	"k" double precision NOT NULL,
	"alpha" double precision NOT NULL,
	"beta" double precision NOT NULL,
	"fit_frequency_min" double precision NOT NULL,
	"fit_frequency_max" double precision NOT NULL,
	"fit_flux_min" double precision NOT NULL,
	"fit_flux_max" double precision NOT NULL,
	"ct0" double precision,
	"ct1" double precision,
	"ct2" double precision,
	"reference_temperature" double precision,
	"bsat_25" double precision NOT NULL,
	"bsat_100" double precision NOT NULL,
	"permeability" double precision NOT NULL,
	"roll_off_a" double precision,
	"roll_off_b" double precision,
	"roll_off_c" double precision,
	"density" double precision NOT NULL,
	"provenance" text NOT NULL,
	"created_by" integer,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "materials_alpha_check" CHECK ("materials"."alpha" > 0 and "materials"."alpha" < 4),
	CONSTRAINT "materials_beta_check" CHECK ("materials"."beta" > 0 and "materials"."beta" < 5),
	CONSTRAINT "materials_k_check" CHECK ("materials"."k" > 0)
);
--> statement-breakpoint
ALTER TABLE "materials" ADD CONSTRAINT "materials_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "materials_lineage_version_idx" ON "materials" USING btree ("lineage","version");--> statement-breakpoint
CREATE UNIQUE INDEX "materials_current_name_idx" ON "materials" USING btree (lower("name")) WHERE "materials"."current";