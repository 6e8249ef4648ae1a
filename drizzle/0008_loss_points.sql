CREATE TABLE "material_loss_points" (
	"id" serial PRIMARY KEY NOT NULL,
	"material_id" integer NOT NULL,
	"position" integer NOT NULL,
	"frequency" double precision NOT NULL,
	"peak_flux" double precision NOT NULL,
	"temperature" double precision NOT NULL,
	"loss_density" double precision NOT NULL,
	"dc_bias" double precision,
	"source" varchar(200),
	CONSTRAINT "material_loss_points_positive_check" CHECK ("material_loss_points"."frequency" > 0 and "material_loss_points"."peak_flux" > 0 and "material_loss_points"."loss_density" > 0)
);
--> statement-breakpoint
ALTER TABLE "material_loss_points" ADD CONSTRAINT "material_loss_points_material_id_materials_id_fk" FOREIGN KEY ("material_id") REFERENCES "public"."materials"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "material_loss_points_material_position_idx" ON "material_loss_points" USING btree ("material_id","position");