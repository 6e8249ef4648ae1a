DROP INDEX "build_units_order_unit_idx";--> statement-breakpoint
ALTER TABLE "build_units" ADD COLUMN "bias_current" double precision;--> statement-breakpoint
ALTER TABLE "build_units" ADD COLUMN "bias_inductance" double precision;--> statement-breakpoint
ALTER TABLE "build_units" ADD COLUMN "voided_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "build_units" ADD COLUMN "voided_by" integer;--> statement-breakpoint
ALTER TABLE "build_units" ADD COLUMN "void_reason" text;--> statement-breakpoint
ALTER TABLE "build_units" ADD CONSTRAINT "build_units_voided_by_users_id_fk" FOREIGN KEY ("voided_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "build_units_order_unit_idx" ON "build_units" USING btree ("order_id","unit_number") WHERE "build_units"."voided_at" is null;