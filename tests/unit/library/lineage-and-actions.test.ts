import { describe, expect, it } from 'vitest';
import { lineageSlug, newLineage } from '../../../server/library/lineage.ts';
import { NO_ACTIONS, recordActions } from '../../../server/library/record-actions.ts';

describe('lineages of new library items', () => {
  it('are the name in lower case with other characters as one hyphen', () => {
    expect(lineageSlug('Demo ferrite Amber 2 (invented)', 'material')).toBe('demo-ferrite-amber-2-invented');
    expect(lineageSlug('ÄÖÜ', 'core')).toBe('core');
  });

  it('count up where the slug is taken, and take the new lineage', () => {
    const taken = new Set(['lab-ring', 'lab-ring-2']);
    expect(newLineage('Lab ring', taken, 'core')).toBe('lab-ring-3');
    expect(newLineage('LAB  RING', taken, 'core')).toBe('lab-ring-4');
    expect(taken.has('lab-ring-4')).toBe(true);
  });

  it('fit the 80-character column with a counter', () => {
    const long = 'x'.repeat(200);
    const taken = new Set<string>();
    newLineage(long, taken, 'material');
    expect(newLineage(long, taken, 'material').length).toBeLessThanOrEqual(80);
  });
});

describe('what a role may do with a stored version', () => {
  const current = { current: true, retired: false };

  it('engineers edit, reviewers and administrators also retire; winders do neither', () => {
    expect(recordActions('engineer', current)).toEqual({ canEdit: true, canRetire: false, canRestore: false });
    expect(recordActions('reviewer', current)).toEqual({ canEdit: true, canRetire: true, canRestore: false });
    expect(recordActions('admin', current)).toEqual({ canEdit: true, canRetire: true, canRestore: false });
    expect(recordActions('winder', current)).toEqual(NO_ACTIONS);
  });

  it('a retired version is restored, not retired again; an older version allows nothing', () => {
    expect(recordActions('reviewer', { current: true, retired: true })).toEqual({ canEdit: true, canRetire: false, canRestore: true });
    expect(recordActions('admin', { current: false, retired: false })).toEqual(NO_ACTIONS);
  });
});
