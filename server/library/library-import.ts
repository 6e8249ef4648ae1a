import { importDecisionsSchema, type CellProblem, type ImportDecision, type ImportPreview } from '@shared/schemas/csv-import';
import type { Tx } from '../db/client.ts';
import type { Actor } from '../http/access.ts';
import {
  analyseRecords,
  decodeCsvText,
  parseCsvTable,
  rowErrors,
  summarisePreview,
  undecidedNames,
  type CsvTableFormat,
  type RowAnalysis,
} from '../http/csv-table.ts';
import type { UploadedFile } from '../http/csv-upload.ts';
import { nameKey } from '../http/name-key.ts';
import { parseWith } from '../http/validate.ts';
import { newLineage } from './lineage.ts';
import type { NewVersion, VersionRow } from './version-store.ts';
import type { VersionedLibrary } from './versioned-library.ts';

/** One library's CSV file: its columns, how a row is checked, and the columns a checked row is stored in. */
export interface LibraryCsvFormat<C extends string, Item extends { name: string }, Values> {
  table: CsvTableFormat<C>;
  /** One row's cells (absent columns as empty) as an item, or its problems by column. */
  validate: (cells: Partial<Record<C, string>>) => { values?: Item; problems: CellProblem[]; notices?: CellProblem[] };
  columnsOf: (item: Item) => Values;
  /** What a new version takes over from the one it replaces (a material's loss points), in the import's transaction. */
  carry?: (tx: Tx, replaced: { from: number; to: number }[]) => Promise<void>;
}

/** What a committed file did, as the import log and the audit entry record it. */
export interface ImportSummary {
  fileName: string;
  rowCount: number;
  created: number;
  versioned: number;
  skipped: number;
}

export type ImportResult = Omit<ImportSummary, 'rowCount'> & { ids: number[] };

/**
 * Written in the import's transaction before the versions (materials keep a log of their uploads); what it
 * answers goes into every new version's columns, the audit entry and the result.
 */
export type ImportLog<Extra> = (tx: Tx, summary: ImportSummary, actor: Actor) => Promise<Extra>;

/**
 * A CSV file into a versioned library: a preview of every row (new, exists or error), then a commit of all rows
 * or none, with a decision per existing name (a new version of it, or skip it).
 */
export class LibraryImport<Row extends VersionRow, Values extends { name: string }, C extends string, Item extends { name: string }> {
  constructor(
    private readonly library: VersionedLibrary<Row, Values>,
    private readonly format: LibraryCsvFormat<C, Item, Values>,
  ) {}

  /** The rows of a file checked one by one, against each other and against the current versions. */
  private analyse(file: UploadedFile, current: Map<string, Row>): RowAnalysis<Item, Row> {
    const records = parseCsvTable(decodeCsvText(file.buffer), this.format.table);
    // A row whose name is the same name as a stored one (look-alike letters, invisible characters) is that item.
    return analyseRecords(records, this.format.validate, (lowerName) => current.get(nameKey(lowerName)));
  }

  async preview(file: UploadedFile): Promise<ImportPreview> {
    const analysis = this.analyse(file, await this.library.store.currentByNameKey());
    return summarisePreview(file.originalname, analysis.rows);
  }

  /** All or nothing, in one transaction: any row problem or missing decision refuses the whole file. */
  async commit<Extra extends object = Record<never, never>>(
    file: UploadedFile,
    rawDecisions: unknown,
    actor: Actor,
    log?: ImportLog<Extra>,
  ): Promise<ImportResult & Extra> {
    const decisions = parseWith(importDecisionsSchema, rawDecisions ?? {});
    const byLowerName = new Map(Object.entries(decisions).map(([name, d]) => [name.trim().toLowerCase(), d] as [string, ImportDecision]));
    const fileName = file.originalname.slice(0, 200) || 'upload.csv';
    const { store, words } = this.library;
    return store.db.transaction(async (tx) => {
      await store.lockNewItems(tx);
      const analysis = this.analyse(file, await store.currentByNameKey(tx));
      if (analysis.rows.some((r) => r.status === 'error')) throw rowErrors(analysis.rows);
      const undecided = undecidedNames(analysis.valid, (lowerName) => byLowerName.has(lowerName));
      if (undecided) throw undecided;

      const taken = await store.lineages(tx);
      const superseded: number[] = [];
      const versions: NewVersion<Values>[] = [];
      // Per new version, the version it replaces (undefined for a new item).
      const replacing: (number | undefined)[] = [];
      let skipped = 0;
      for (const { values: item, existing } of analysis.valid) {
        const columns = { ...this.format.columnsOf(item), createdBy: actor.id };
        if (!existing) {
          versions.push({ ...columns, lineage: newLineage(item.name, taken, words.noun), version: 1, retired: false });
          replacing.push(undefined);
        } else if (byLowerName.get(item.name.toLowerCase()) === 'skip') {
          skipped++;
        } else {
          // A new version keeps the state of the one it replaces: a retired item stays retired.
          superseded.push(existing.id);
          versions.push({ ...columns, lineage: existing.lineage, version: existing.version + 1, retired: existing.retired });
          replacing.push(existing.id);
        }
      }
      const counts = { created: versions.length - superseded.length, versioned: superseded.length, skipped };
      // Without a log there is nothing to add: the empty object is the whole of the default `Extra`.
      const extra = (log ? await log(tx, { fileName, rowCount: analysis.rows.length, ...counts }, actor) : {}) as Extra;
      await store.supersede(tx, superseded);
      const ids = await store.insertVersions(
        tx,
        versions.map((v) => ({ ...v, ...extra })),
      );
      const replaced = ids.flatMap((to, i) => (replacing[i] === undefined ? [] : [{ from: replacing[i]!, to }]));
      if (replaced.length) await this.format.carry?.(tx, replaced);
      await this.library.audit.record(
        { actorId: actor.id, action: `${words.noun}s.imported`, target: fileName, details: { ...extra, ...counts } },
        tx,
      );
      return { fileName, ...counts, ids, ...extra };
    });
  }
}
