-- The designs list (designs, their latest revision's status and spec, the owner's display name) gets a change counter
-- too (see 0004_change_counters.sql): bumped by every statement that changes a design or a revision, and by a change
-- of a user's display name (the only user column the list shows), so a cached page is rebuilt once any of it moves.
INSERT INTO "change_counters" ("name") VALUES ('designs') ON CONFLICT DO NOTHING;
--> statement-breakpoint
CREATE TRIGGER "designs_changed" AFTER INSERT OR UPDATE OR DELETE OR TRUNCATE ON "designs"
FOR EACH STATEMENT EXECUTE FUNCTION "bump_change_counter"('designs');
--> statement-breakpoint
CREATE TRIGGER "design_revisions_changed" AFTER INSERT OR UPDATE OR DELETE OR TRUNCATE ON "design_revisions"
FOR EACH STATEMENT EXECUTE FUNCTION "bump_change_counter"('designs');
--> statement-breakpoint
CREATE TRIGGER "users_shown_in_designs_changed" AFTER INSERT OR DELETE OR TRUNCATE OR UPDATE OF "display_name" ON "users"
FOR EACH STATEMENT EXECUTE FUNCTION "bump_change_counter"('designs');
