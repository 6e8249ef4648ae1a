import { remove } from 'confusables';

/**
 * The form two names are compared in: NFKC (full-width letters, ligatures, non-breaking spaces), invisible
 * characters dropped (zero-width spaces and joiners, soft hyphens), runs of spaces as one, look-alike letters
 * folded to the one they imitate (Cyrillic "а" → "a", Greek "Ν" → "N"), and case ignored. Names with the same
 * key are the same name.
 */
export function nameKey(name: string): string {
  const visible = name
    .normalize('NFKC')
    .replace(/\p{Default_Ignorable_Code_Point}/gu, '')
    .replace(/\s+/gu, ' ')
    .trim();
  return remove(visible).toLowerCase();
}

/** The first of `rows` whose name is the same name as `name`, by `nameKey`. */
export function sameName<T extends { name: string }>(
  rows: Iterable<T>,
  name: string,
  except: (row: T) => boolean = () => false,
): T | undefined {
  const key = nameKey(name);
  for (const row of rows) if (!except(row) && nameKey(row.name) === key) return row;
  return undefined;
}
