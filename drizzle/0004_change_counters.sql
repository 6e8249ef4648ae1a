-- A counter per kind of data, bumped by every statement that changes it (in the same transaction). The session read
-- that every signed-in request makes also reads these counters, so a cached listing can be reused while its counter
-- has not moved, without a query of its own, on any number of app instances.
CREATE TABLE "change_counters" ("name" varchar(40) PRIMARY KEY, "n" bigint NOT NULL DEFAULT 0);
--> statement-breakpoint
INSERT INTO "change_counters" ("name") VALUES ('materials');
--> statement-breakpoint
CREATE FUNCTION "bump_change_counter"() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  INSERT INTO "change_counters" ("name", "n") VALUES (TG_ARGV[0], 1)
  ON CONFLICT ("name") DO UPDATE SET "n" = "change_counters"."n" + 1;
  RETURN NULL;
END
$$;
--> statement-breakpoint
CREATE TRIGGER "materials_changed" AFTER INSERT OR UPDATE OR DELETE OR TRUNCATE ON "materials"
FOR EACH STATEMENT EXECUTE FUNCTION "bump_change_counter"('materials');
