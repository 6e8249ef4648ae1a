-- The demo materials' names echoed real grade and permeability designations; they take neutral invented names (a
-- colour each). Every version of a demo lineage moves to the new lineage; a version still carrying the old name takes
-- the new one (a version a user renamed keeps its own name). Ids do not change, so designs keep pointing at them. A
-- lineage whose new name or lineage is already taken by a user's material is left as it was.
UPDATE "materials" AS m
SET "lineage" = r.new_lineage,
    "name" = CASE WHEN m."name" = r.old_name THEN r.new_name ELSE m."name" END
FROM (VALUES
  ('demo-ferrite-mf-95-illustrative', 'Demo ferrite MF-95 (illustrative)', 'demo-ferrite-amber-illustrative', 'Demo ferrite Amber (illustrative)'),
  ('demo-ferrite-mf-140-illustrative', 'Demo ferrite MF-140 (illustrative)', 'demo-ferrite-teal-illustrative', 'Demo ferrite Teal (illustrative)'),
  ('demo-ferrite-mf-60-illustrative', 'Demo ferrite MF-60 (illustrative)', 'demo-ferrite-slate-illustrative', 'Demo ferrite Slate (illustrative)'),
  ('demo-powder-p-60-illustrative', 'Demo powder P-60 (illustrative)', 'demo-powder-moss-illustrative', 'Demo powder Moss (illustrative)'),
  ('demo-powder-p-26-illustrative', 'Demo powder P-26 (illustrative)', 'demo-powder-ochre-illustrative', 'Demo powder Ochre (illustrative)')
) AS r(old_lineage, old_name, new_lineage, new_name)
WHERE m."lineage" = r.old_lineage
  AND NOT EXISTS (
    SELECT 1 FROM "materials" AS taken
    WHERE taken."lineage" = r.new_lineage OR (taken."current" AND lower(taken."name") = lower(r.new_name))
  );
