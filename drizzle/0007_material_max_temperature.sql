-- A material's highest tolerated hot-spot temperature (°C), from the CSV column max_temperature; null: the engine's
-- default for its family (200 °C for ferrite, none for the others).
ALTER TABLE "materials" ADD COLUMN "max_temperature" double precision;
