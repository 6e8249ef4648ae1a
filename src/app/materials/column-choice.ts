import { signal } from '@angular/core';

/** A table column the user may show or hide, with its header text for the chooser. */
export interface ChoosableColumn {
  id: string;
  label: string;
  /** Shown until the user chooses otherwise. */
  shown: boolean;
}

/**
 * Which of a table's optional columns are shown, kept in the browser's storage under `key` so the choice outlives the
 * page. A stored value that does not read (another version's, edited by hand) gives the defaults back.
 */
export class ColumnChoice {
  private readonly chosen = signal<ReadonlySet<string>>(new Set());
  readonly shown = this.chosen.asReadonly();

  constructor(
    readonly columns: readonly ChoosableColumn[],
    private readonly key: string,
    private readonly storage: Storage | null,
  ) {
    this.chosen.set(this.read() ?? new Set(columns.filter((c) => c.shown).map((c) => c.id)));
  }

  /** The shown optional columns in table order, between the fixed ones before and after them. */
  displayed(before: readonly string[], after: readonly string[]): string[] {
    const shown = this.chosen();
    return [...before, ...this.columns.filter((c) => shown.has(c.id)).map((c) => c.id), ...after];
  }

  toggle(id: string): void {
    const next = new Set(this.chosen());
    if (next.has(id)) next.delete(id);
    else next.add(id);
    this.chosen.set(next);
    try {
      this.storage?.setItem(this.key, JSON.stringify([...next]));
    } catch {
      // Storage full or refused (private mode): the choice holds for this page only.
    }
  }

  private read(): Set<string> | null {
    try {
      const stored: unknown = JSON.parse(this.storage?.getItem(this.key) ?? 'null');
      if (!Array.isArray(stored)) return null;
      const known = new Set(this.columns.map((c) => c.id));
      return new Set(stored.filter((id): id is string => typeof id === 'string' && known.has(id)));
    } catch {
      return null;
    }
  }
}

/** The browser's local storage, or null where it is not available (tests, a refused origin). */
export function localStorageOf(view: Window | null): Storage | null {
  try {
    return view?.localStorage ?? null;
  } catch {
    return null;
  }
}
