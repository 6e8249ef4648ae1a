-- Material versions store their temperature behaviour and powder roll-off under our own names instead of the engine's
-- bare constants: factor F0 + c·(T − T0)² (lowest_loss_temperature T0 °C, lowest_loss_factor F0 > 0, loss_curvature
-- c ≥ 0 1/K²) for ct2·T² − ct1·T + ct0, and μ/μi = 1/(1 + (H/H½)ⁿ) (roll_off_half_field H½ A/m, roll_off_steepness n)
-- for 1/(a + b·H^c). Stored rows are converted before the old columns go (algebra, the same conversions as
-- shared/fitting/temperature-fit.ts and rolloff-fit.ts).
ALTER TABLE "materials" ADD COLUMN "lowest_loss_temperature" double precision;--> statement-breakpoint
ALTER TABLE "materials" ADD COLUMN "lowest_loss_factor" double precision;--> statement-breakpoint
ALTER TABLE "materials" ADD COLUMN "loss_curvature" double precision;--> statement-breakpoint
ALTER TABLE "materials" ADD COLUMN "roll_off_half_field" double precision;--> statement-breakpoint
ALTER TABLE "materials" ADD COLUMN "roll_off_steepness" double precision;--> statement-breakpoint
-- An upward parabola with a positive minimum converts exactly: T0 = ct1/(2·ct2), F0 = ct0 − ct1²/(4·ct2), c = ct2.
UPDATE "materials" SET
  "lowest_loss_temperature" = "ct1" / (2 * "ct2"),
  "lowest_loss_factor" = "ct0" - "ct1" * "ct1" / (4 * "ct2"),
  "loss_curvature" = "ct2"
WHERE "ct2" > 0 AND "ct1" IS NOT NULL AND "ct0" - "ct1" * "ct1" / (4 * "ct2") > 0;--> statement-breakpoint
-- A flat positive factor converts exactly, with T0 = 25 °C (any T0 gives the same factor when c = 0).
UPDATE "materials" SET "lowest_loss_temperature" = 25, "lowest_loss_factor" = "ct0", "loss_curvature" = 0
WHERE "ct2" = 0 AND "ct1" = 0 AND "ct0" > 0;--> statement-breakpoint
-- Any other stored quadratic (opening downwards, a slope, or dipping to zero) cannot be positive everywhere: it becomes
-- the flat factor of its mean over −40 °C … max_temperature (200 °C without one), in closed form
-- (1/(U − L))·∫ (ct2·T² − ct1·T + ct0) dT = ct2·(U² + U·L + L²)/3 − ct1·(U + L)/2 + ct0, at least 0.01 (the engine's
-- floor), and the provenance says so (kept within the 500 characters a CSV cell holds).
UPDATE "materials" SET
  "lowest_loss_temperature" = 25,
  "loss_curvature" = 0,
  "lowest_loss_factor" = GREATEST(
    0.01,
    "ct2" * (power(coalesce("max_temperature", 200), 2) + coalesce("max_temperature", 200) * -40 + 1600) / 3
      - "ct1" * (coalesce("max_temperature", 200) - 40) / 2
      + "ct0"
  ),
  "provenance" = left("provenance", 430) || ' [temperature behaviour converted approximately from an old quadratic]'
WHERE "ct0" IS NOT NULL AND "ct1" IS NOT NULL AND "ct2" IS NOT NULL AND "lowest_loss_factor" IS NULL;--> statement-breakpoint
-- 1/(a + b·H^c) = (1/a)·1/(1 + (H/H½)^c) with H½ = (a/b)^(1/c): exact, with μi divided by a. A b of 0 is no roll-off
-- at all (μ = μi/a everywhere): only μi changes.
UPDATE "materials" SET
  "roll_off_half_field" = CASE WHEN "roll_off_b" > 0 THEN power("roll_off_a" / "roll_off_b", 1 / "roll_off_c") END,
  "roll_off_steepness" = CASE WHEN "roll_off_b" > 0 THEN "roll_off_c" END,
  "permeability" = "permeability" / "roll_off_a"
WHERE "roll_off_a" > 0 AND "roll_off_b" IS NOT NULL AND "roll_off_c" > 0;--> statement-breakpoint
ALTER TABLE "materials" DROP COLUMN "ct0";--> statement-breakpoint
ALTER TABLE "materials" DROP COLUMN "ct1";--> statement-breakpoint
ALTER TABLE "materials" DROP COLUMN "ct2";--> statement-breakpoint
ALTER TABLE "materials" DROP COLUMN "roll_off_a";--> statement-breakpoint
ALTER TABLE "materials" DROP COLUMN "roll_off_b";--> statement-breakpoint
ALTER TABLE "materials" DROP COLUMN "roll_off_c";--> statement-breakpoint
-- The named parameters are positive by construction; the database holds them to it (NULL: none given).
ALTER TABLE "materials" ADD CONSTRAINT "materials_loss_factor_check" CHECK ("materials"."lowest_loss_factor" > 0 and "materials"."loss_curvature" >= 0);--> statement-breakpoint
ALTER TABLE "materials" ADD CONSTRAINT "materials_roll_off_check" CHECK ("materials"."roll_off_half_field" > 0 and "materials"."roll_off_steepness" > 0);
