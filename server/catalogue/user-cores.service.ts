import type { CoreShape } from '@shared/engine/types';
import {
  CORE_CSV_COLUMNS,
  importDecisionsSchema,
  REQUIRED_CORE_COLUMNS,
  validateCoreCells,
  type CoreCsvColumn,
  type ImportDecision,
  type ImportPreview,
} from '@shared/schemas/core-csv';
import type { ListedCore, UserCoreRequest } from '@shared/schemas/cores';
import { checkedUserCoreShape } from '@shared/schemas/user-core-shape';
import type { AuditService } from '../audit/audit.service.ts';
import type { Actor } from '../http/access.ts';
import {
  analyseRecords,
  decodeCsvText,
  parseCsvTable,
  rowErrors,
  stringifyCsvTable,
  summarisePreview,
  undecidedNames,
  type CsvTableFormat,
} from '../http/csv-table.ts';
import type { UploadedFile } from '../http/csv-upload.ts';
import { badRequest, conflict, fieldErrorsFromZod, notFound } from '../http/errors.ts';
import { nameKey, sameName } from '../http/name-key.ts';
import { parseWith } from '../http/validate.ts';
import { lineageSlug } from '../materials/materials.service.ts';
import type { CatalogueService } from './catalogue.service.ts';
import { CORE_TEMPLATE_ROWS } from './core-template.ts';
import type { NewUserCoreVersion, UserCoreRow, UserCoreWithAuthor, UserCoresRepository } from './user-cores.repository.ts';

export type CoreOrigin = 'shipped' | 'user';

function listed(shape: CoreShape, origin: CoreOrigin, row?: UserCoreWithAuthor): ListedCore {
  return {
    ...shape,
    areaProduct: shape.ae * shape.windowArea,
    origin,
    ...(row
      ? {
          userCoreId: row.id,
          version: row.version,
          retired: row.retired,
          createdBy: row.createdByName,
          createdAt: row.createdAt.toISOString(),
        }
      : {}),
  };
}

/** The engine's CoreShape from a request, checked with the shared core schema. */
export function shapeFromRequest(request: UserCoreRequest): CoreShape {
  const { shape, error } = checkedUserCoreShape(request);
  if (error) {
    const fields = fieldErrorsFromZod(error);
    throw badRequest(
      `The core is not consistent: ${Object.entries(fields)
        .map(([k, v]) => `${k}: ${v}`)
        .slice(0, 3)
        .join('; ')}`,
      fields,
    );
  }
  return shape;
}

/** A user core file holds at most this many rows: every current core joins every search. */
export const MAX_CORE_ROWS = 1_000;
const CORE_TABLE: CsvTableFormat<CoreCsvColumn> = {
  columns: CORE_CSV_COLUMNS,
  required: REQUIRED_CORE_COLUMNS,
  noun: 'core',
  maxRows: MAX_CORE_ROWS,
};

/** A lineage of its own for a new core: its name, a time stamp, and a counter where two names give one slug. */
function newLineage(name: string, stamp: string, taken: Set<string>): string {
  const slug = lineageSlug(name);
  let lineage = `${slug}-${stamp}`;
  for (let n = 2; taken.has(lineage); n++) lineage = `${slug.slice(0, 64)}-${stamp}-${n}`;
  taken.add(lineage);
  return lineage;
}

/** Shipped cores plus the cores users added (versioned like materials). */
export class UserCoresService {
  constructor(
    private readonly repo: UserCoresRepository,
    private readonly catalogue: CatalogueService,
    private readonly audit: AuditService,
  ) {
    // Searches read the catalogue synchronously, so the stored user cores are handed over once at start-up;
    // a database that is not up yet only delays them until the next change.
    this.refresh().catch(() => undefined);
  }

  /** Hand the current user cores to the catalogue, so searches and evaluations see them. */
  async refresh(): Promise<void> {
    this.catalogue.setUserCores((await this.repo.listCurrent(false)).map((r) => r.shape as CoreShape));
  }

  async list() {
    const shipped = this.catalogue.shippedCores().map((c) => listed(c, 'shipped'));
    const user = (await this.repo.listCurrent()).map((row) => listed(row.shape as CoreShape, 'user', row));
    return [...shipped, ...user];
  }

  /** A core by id for calculations: shipped first, then current user cores that are not retired. */
  async core(id: string): Promise<CoreShape> {
    const shipped = this.catalogue.shippedCores().find((c) => c.id === id);
    if (shipped) return shipped;
    const user = (await this.repo.listCurrent(false)).find((r) => (r.shape as CoreShape).id === id);
    if (!user) throw badRequest(`No core "${id}" in the catalogue.`, { coreId: `Unknown core "${id}"` });
    return user.shape as CoreShape;
  }

  async history(id: number) {
    const row = await this.repo.findById(id);
    if (!row) throw notFound(`No user core with id ${id}.`);
    return (await this.repo.history(row.lineage)).map((r) => listed(r.shape as CoreShape, 'user', r));
  }

  private async assertNameFree(name: string, exceptLineage?: string) {
    const shipped = sameName(
      this.catalogue.shippedCores().map((c) => ({ name: c.id })),
      name,
    );
    if (shipped)
      throw conflict(`"${name}" is the name of the shipped core "${shipped.name}"; choose another name.`, {
        name: 'Name of a shipped core',
      });
    const clash = sameName(await this.repo.listCurrent(), name, (r) => r.lineage === exceptLineage);
    if (clash)
      throw conflict(`A user core is already called "${clash.name}" (the same name as "${name}").`, {
        name: `Same name as "${clash.name}"`,
      });
  }

  async create(request: UserCoreRequest, actor: Actor) {
    const shape = shapeFromRequest(request);
    await this.assertNameFree(request.name);
    const lineage = newLineage(request.name, Date.now().toString(36), new Set());
    const row = await this.repo.db.transaction(async (tx) => {
      const added = await this.repo.addVersion(tx, {
        lineage,
        version: 1,
        name: request.name,
        family: shape.family,
        shape,
        createdBy: actor.id,
        retired: false,
      });
      await this.audit.record({ actorId: actor.id, action: 'core.added', target: request.name, details: { id: added.id } }, tx);
      return added;
    });
    await this.refresh();
    return listed(shape, 'user', { ...row, createdByName: actor.displayName });
  }

  async edit(id: number, request: UserCoreRequest, actor: Actor) {
    const previous = await this.repo.findById(id);
    if (!previous) throw notFound(`No user core with id ${id}.`);
    if (!previous.current) throw conflict('Only the current version of a core can be edited.', { id: 'Not the current version' });
    const shape = shapeFromRequest(request);
    await this.assertNameFree(request.name, previous.lineage);
    const row = await this.repo.db.transaction(async (tx) => {
      const added = await this.repo.addVersion(
        tx,
        {
          lineage: previous.lineage,
          version: previous.version + 1,
          name: request.name,
          family: shape.family,
          shape,
          createdBy: actor.id,
          retired: previous.retired,
        },
        previous.id,
      );
      await this.audit.record(
        { actorId: actor.id, action: 'core.edited', target: request.name, details: { id: added.id, version: added.version } },
        tx,
      );
      return added;
    });
    await this.refresh();
    return listed(shape, 'user', { ...row, createdByName: actor.displayName });
  }

  async setRetired(id: number, retired: boolean, actor: Actor) {
    const row = await this.repo.db.transaction(async (tx) => {
      const changed = await this.repo.setRetired(id, retired, tx);
      if (!changed) throw notFound(`No current user core with id ${id}.`);
      await this.audit.record(
        { actorId: actor.id, action: retired ? 'core.retired' : 'core.unretired', target: changed.name, details: { id } },
        tx,
      );
      return changed;
    });
    await this.refresh();
    return listed(row.shape as CoreShape, 'user', { ...row, createdByName: null });
  }

  template(): string {
    return stringifyCsvTable(CORE_TEMPLATE_ROWS, CORE_CSV_COLUMNS);
  }

  /** The rows of a core file checked one by one, against each other, the shipped names and the stored user cores. */
  private analyse(file: UploadedFile, existing: Map<string, UserCoreRow>) {
    const shipped = new Set(this.catalogue.shippedCores().map((c) => nameKey(c.id)));
    // A row whose name is the same name as a stored core (look-alike letters, invisible characters) is that core.
    const byKey = new Map([...existing.values()].map((r) => [nameKey(r.name), r]));
    const records = parseCsvTable(decodeCsvText(file.buffer), CORE_TABLE);
    return analyseRecords(
      records,
      (cells) => {
        const result = validateCoreCells(cells);
        const name = (cells.name ?? '').trim();
        if (!shipped.has(nameKey(name))) return result;
        return { problems: [...result.problems, { column: 'name', message: `name "${name}" is a shipped core; choose another name` }] };
      },
      (lowerName) => byKey.get(nameKey(lowerName)),
    );
  }

  async preview(file: UploadedFile): Promise<ImportPreview> {
    const analysis = this.analyse(file, await this.repo.currentByLowerName());
    return summarisePreview(file.originalname, analysis.rows);
  }

  /** All or nothing, in one transaction: any row problem or missing decision refuses the whole file. */
  async commit(file: UploadedFile, rawDecisions: unknown, actor: Actor) {
    const decisions = parseWith(importDecisionsSchema, rawDecisions ?? {});
    const byLowerName = new Map(Object.entries(decisions).map(([name, d]) => [name.trim().toLowerCase(), d] as [string, ImportDecision]));
    const fileName = file.originalname.slice(0, 200) || 'upload.csv';
    const result = await this.repo.db.transaction(async (tx) => {
      const analysis = this.analyse(file, await this.repo.currentByLowerName(tx));
      if (analysis.rows.some((r) => r.status === 'error')) throw rowErrors(analysis.rows);
      const undecided = undecidedNames(analysis.valid, (lowerName) => byLowerName.has(lowerName));
      if (undecided) throw undecided;

      const stamp = Date.now().toString(36);
      const taken = new Set<string>();
      const superseded: number[] = [];
      const toInsert: NewUserCoreVersion[] = [];
      let skipped = 0;
      for (const { values, existing } of analysis.valid) {
        const shape = shapeFromRequest(values);
        const core = { name: values.name, family: shape.family, shape, createdBy: actor.id };
        if (!existing) {
          toInsert.push({ ...core, lineage: newLineage(values.name, stamp, taken), version: 1, retired: false });
        } else if (byLowerName.get(values.name.toLowerCase()) === 'skip') {
          skipped++;
        } else {
          superseded.push(existing.id);
          toInsert.push({ ...core, lineage: existing.lineage, version: existing.version + 1, retired: existing.retired });
        }
      }
      await this.repo.supersede(tx, superseded);
      const inserted = await this.repo.insertVersions(tx, toInsert);
      const created = toInsert.length - superseded.length;
      await this.audit.record(
        { actorId: actor.id, action: 'cores.imported', target: fileName, details: { created, versioned: superseded.length, skipped } },
        tx,
      );
      return { created, versioned: superseded.length, skipped, coreIds: inserted.map((r) => r.id) };
    });
    await this.refresh();
    return { fileName, ...result };
  }
}
