/** The readable part of a lineage: the name in lower case, runs of other characters as one hyphen. */
export function lineageSlug(name: string, fallback: string): string {
  return (
    name
      .toLowerCase()
      .replace(/[^a-z0-9]+/g, '-')
      .replace(/^-|-$/g, '')
      .slice(0, 70) || fallback
  );
}

/**
 * A lineage of its own for a new item: its slug, with a counter where the slug is taken (two names with one
 * slug, or a retired item's). `taken` holds every lineage of the table and gets the new one.
 */
export function newLineage(name: string, taken: Set<string>, fallback: string): string {
  const base = lineageSlug(name, fallback);
  let lineage = base;
  for (let n = 2; taken.has(lineage); n++) lineage = `${base}-${n}`;
  taken.add(lineage);
  return lineage;
}
