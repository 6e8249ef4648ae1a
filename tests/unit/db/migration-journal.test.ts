// Drizzle's migrator applies a migration only when its journal time is later than the last one a database has
// applied: a migration generated on a branch with an earlier time than one already on main would be skipped on
// every existing database (a fresh one still gets it, so only an upgrade shows the fault).
import { existsSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';

const drizzleDir = path.resolve(import.meta.dirname, '../../../drizzle');
const journal = JSON.parse(readFileSync(path.join(drizzleDir, 'meta/_journal.json'), 'utf8')) as {
  entries: { idx: number; when: number; tag: string }[];
};

describe('the migration journal', () => {
  it('lists migrations in order with strictly rising times, each with its SQL file', () => {
    journal.entries.forEach((entry, i) => {
      expect(entry.idx).toBe(i);
      expect(existsSync(path.join(drizzleDir, `${entry.tag}.sql`))).toBe(true);
      if (i > 0)
        expect(entry.when, `${entry.tag} must be later than ${journal.entries[i - 1]!.tag}`).toBeGreaterThan(journal.entries[i - 1]!.when);
    });
  });
});
