import type { AuditService } from '../audit/audit.service.ts';
import type { Tx } from '../db/client.ts';
import type { Actor } from '../http/access.ts';
import { conflict, notFound, type AppError } from '../http/errors.ts';
import { sameName } from '../http/name-key.ts';
import { newLineage } from './lineage.ts';
import type { VersionRow, VersionStore, WithAuthor } from './version-store.ts';

/** How one library names itself in refusals, audit entries and new lineages. */
export interface LibraryWords {
  /** "material", "core": audit actions (`material.edited`, `cores.imported`) and "a new version of this core". */
  noun: string;
  /** "material", "user core": "No user core with id 3", "Another user core is already called …". */
  label: string;
}

export interface LibraryOptions<Row extends VersionRow, Values extends { name: string }> {
  store: VersionStore<Row, Values>;
  audit: AuditService;
  words: LibraryWords;
  /** A name the library may not take besides its own current names (a shipped core's): the refusal, or undefined. */
  reservedName?: (name: string) => AppError | undefined;
}

/** What else a new version's transaction does: its audit action, and writes that go with the new version. */
export interface VersionChange<Row> {
  action?: string;
  /** Runs after the insert, before the audit entry; what it answers joins the entry's details. */
  within?: (tx: Tx, inserted: Row, previous: Row) => Promise<Record<string, unknown> | void>;
}

/**
 * A versioned library (materials, user cores): every change adds a version with the same lineage and the next
 * number, only the newest version is current, and designs keep pointing at the version they used. Each change
 * and its audit entry commit together.
 */
export class VersionedLibrary<Row extends VersionRow, Values extends { name: string }> {
  readonly store: VersionStore<Row, Values>;
  readonly words: LibraryWords;
  readonly audit: AuditService;
  private readonly reservedName: (name: string) => AppError | undefined;

  constructor(options: LibraryOptions<Row, Values>) {
    this.store = options.store;
    this.audit = options.audit;
    this.words = options.words;
    this.reservedName = options.reservedName ?? (() => undefined);
  }

  private missing(id: number): AppError {
    return notFound(`No ${this.words.label} with id ${id}.`);
  }

  /** Every version of the lineage the version `id` belongs to, newest first. */
  async history(id: number): Promise<WithAuthor<Row>[]> {
    const row = await this.store.findById(id);
    if (!row) throw this.missing(id);
    return this.store.history(row.lineage);
  }

  /** Refuses a name that is the same name as a reserved one or another lineage's current version. */
  async assertNameFree(tx: Tx, name: string, exceptLineage?: string): Promise<void> {
    const reserved = this.reservedName(name);
    if (reserved) throw reserved;
    const clash = sameName(await this.store.listCurrent(true, tx), name, (r) => r.lineage === exceptLineage);
    if (clash)
      throw conflict(`Another ${this.words.label} is already called "${clash.name}" (the same name as "${name}").`, {
        name: `Same name as "${clash.name}"`,
      });
  }

  /** A new item: version 1 of a lineage of its own. */
  async create(values: Values, actor: Actor): Promise<Row> {
    return this.store.db.transaction(async (tx) => {
      await this.store.lockNewItems(tx);
      await this.assertNameFree(tx, values.name);
      const lineage = newLineage(values.name, await this.store.lineages(tx), this.words.noun);
      const row = await this.store.insertVersion(tx, { ...values, lineage, version: 1, retired: false, createdBy: actor.id });
      await this.audit.record({ actorId: actor.id, action: `${this.words.noun}.added`, target: row.name, details: { id: row.id } }, tx);
      return row;
    });
  }

  /**
   * The next version of the current version `id`, with the values `next` gives for it (it throws to refuse).
   * The version is locked first: of several writers of one version, one adds the next version and the others
   * then find it no longer current (409). `change` names the audit action (default `<noun>.edited`) and writes
   * what belongs to the new version (loss points) in the same transaction.
   */
  async newVersion(id: number, actor: Actor, next: (row: Row) => Values, change: VersionChange<Row> = {}): Promise<Row> {
    return this.store.db.transaction(async (tx) => {
      const row = await this.store.lockById(tx, id);
      if (!row) throw this.missing(id);
      if (!row.current)
        throw conflict(`Only the current version of a ${this.words.noun} can be edited.`, { id: 'Not the current version' });
      const values = next(row);
      await this.assertNameFree(tx, values.name, row.lineage);
      await this.store.supersede(tx, [row.id]);
      const inserted = await this.store.insertVersion(tx, {
        ...values,
        lineage: row.lineage,
        version: row.version + 1,
        retired: row.retired,
        createdBy: actor.id,
      });
      const details = (await change.within?.(tx, inserted, row)) ?? {};
      await this.audit.record(
        {
          actorId: actor.id,
          action: change.action ?? `${this.words.noun}.edited`,
          target: inserted.name,
          details: { id: inserted.id, version: inserted.version, ...details },
        },
        tx,
      );
      return inserted;
    });
  }

  /** Retires (hidden from new searches, designs keep it) or restores the current version `id`. */
  async setRetired(id: number, retired: boolean, actor: Actor): Promise<Row> {
    return this.store.db.transaction(async (tx) => {
      const changed = await this.store.setRetired(tx, id, retired);
      if (!changed) {
        if (await this.store.findById(id, tx))
          throw conflict(`Only the current version of a ${this.words.noun} can be retired or restored.`, {
            id: 'Not the current version',
          });
        throw this.missing(id);
      }
      await this.audit.record(
        {
          actorId: actor.id,
          action: `${this.words.noun}.${retired ? 'retired' : 'unretired'}`,
          target: changed.name,
          details: { id },
        },
        tx,
      );
      return changed;
    });
  }
}
