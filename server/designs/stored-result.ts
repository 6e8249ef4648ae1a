import type { StoredResult } from '@shared/schemas/designs';
import { conflict } from '../http/errors.ts';

/** A revision's status and its saved result as `readStoredResult` gives it. */
interface SavedFigures {
  status: string;
  result: StoredResult | null;
  resultUnreadable: string | null;
}

/**
 * Refuses a revision whose saved figures were kept by an older version and no longer read, with a 409 that
 * says what to do: the figures are never guessed at, and those of a revision past the draft are never silently
 * recomputed.
 */
export function refuseUnreadableResult(label: string, revision: SavedFigures): void {
  if (revision.resultUnreadable === null) return;
  const remedy = revision.status === 'draft' ? 'save the draft again to evaluate it afresh' : 'start a new revision from it and save that';
  throw conflict(`${label} keeps figures saved by an older version that no longer read (${revision.resultUnreadable}); ${remedy}.`, {
    result: 'Saved figures no longer read',
  });
}

/** The saved result a file is made from: a 409 when there is none yet or it no longer reads. */
export function requireStoredResult(label: string, revision: SavedFigures): StoredResult {
  refuseUnreadableResult(label, revision);
  if (!revision.result) throw conflict(`${label} has no chosen construction yet; pick a candidate first.`);
  return revision.result;
}
