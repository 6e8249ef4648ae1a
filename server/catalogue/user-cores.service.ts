import type { CoreShape } from '@shared/engine/types';
import type { Role } from '@shared/schemas/auth';
import { CORE_CSV_COLUMNS, REQUIRED_CORE_COLUMNS, validateCoreCells, type CoreCsvColumn } from '@shared/schemas/core-csv';
import type { ListedCore, UserCoreRequest } from '@shared/schemas/cores';
import { checkedUserCoreShape } from '@shared/schemas/user-core-shape';
import type { AuditService } from '../audit/audit.service.ts';
import type { Actor } from '../http/access.ts';
import { stringifyCsvTable, type CsvTableFormat } from '../http/csv-table.ts';
import type { UploadedFile } from '../http/csv-upload.ts';
import { badRequest, conflict, fieldErrorsFromZod } from '../http/errors.ts';
import { nameKey } from '../http/name-key.ts';
import { LibraryImport } from '../library/library-import.ts';
import { NO_ACTIONS, recordActions } from '../library/record-actions.ts';
import type { WithAuthor } from '../library/version-store.ts';
import { VersionedLibrary } from '../library/versioned-library.ts';
import type { CatalogueService } from './catalogue.service.ts';
import { CORE_TEMPLATE_ROWS } from './core-template.ts';
import type { UserCoreRow, UserCoreValues, UserCoresRepository } from './user-cores.repository.ts';

export type CoreOrigin = 'shipped' | 'user';

/** A core by id: shipped first, then current user cores that are not retired (also what a check worker reads). */
export async function coreById(
  catalogue: CatalogueService,
  repo: Pick<UserCoresRepository, 'listCurrent'>,
  id: string,
): Promise<CoreShape> {
  const shipped = catalogue.shippedCores().find((c) => c.id === id);
  if (shipped) return shipped;
  const user = (await repo.listCurrent(false)).find((r) => r.shape.id === id);
  if (!user) throw badRequest(`No core "${id}" in the catalogue.`, { coreId: `Unknown core "${id}"` });
  return user.shape;
}

function listed(shape: CoreShape, origin: CoreOrigin, role: Role, row?: WithAuthor<UserCoreRow>): ListedCore {
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
          ...recordActions(role, row),
        }
      : NO_ACTIONS),
  };
}

const listedUserCore = (row: WithAuthor<UserCoreRow>, role: Role) => listed(row.shape, 'user', role, row);

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

/** The columns a user core is stored in: its name and family beside the whole shape. */
function columnsOf(request: UserCoreRequest): UserCoreValues {
  const shape = shapeFromRequest(request);
  return { name: request.name, family: shape.family, shape };
}

/** A user core file holds at most this many rows: every current core joins every search. */
export const MAX_CORE_ROWS = 1_000;
const CORE_TABLE: CsvTableFormat<CoreCsvColumn> = {
  columns: CORE_CSV_COLUMNS,
  required: REQUIRED_CORE_COLUMNS,
  noun: 'core',
  maxRows: MAX_CORE_ROWS,
};

/** Shipped cores plus the cores users added (a versioned library, like materials). */
export class UserCoresService {
  private readonly library: VersionedLibrary<UserCoreRow, UserCoreValues>;
  private readonly csv: LibraryImport<UserCoreRow, UserCoreValues, CoreCsvColumn, UserCoreRequest>;

  constructor(
    private readonly repo: UserCoresRepository,
    private readonly catalogue: CatalogueService,
    audit: AuditService,
  ) {
    this.library = new VersionedLibrary({
      store: repo,
      audit,
      words: { noun: 'core', label: 'user core' },
      reservedName: (name) => {
        const shipped = this.shippedName(name);
        return shipped
          ? conflict(`"${name}" is the name of the shipped core "${shipped}"; choose another name.`, { name: 'Name of a shipped core' })
          : undefined;
      },
    });
    this.csv = new LibraryImport(this.library, {
      table: CORE_TABLE,
      validate: (cells) => {
        const result = validateCoreCells(cells);
        const name = (cells.name ?? '').trim();
        if (!this.shippedName(name)) return result;
        return { problems: [...result.problems, { column: 'name', message: `name "${name}" is a shipped core; choose another name` }] };
      },
      columnsOf,
    });
    // Searches read the catalogue synchronously, so the stored user cores are handed over once at start-up;
    // a database that is not up yet only delays them until the next change.
    this.refresh().catch(() => undefined);
  }

  /** The shipped core whose id is the same name as `name`, if any. */
  private shippedName(name: string): string | undefined {
    const key = nameKey(name);
    return this.catalogue.shippedCores().find((c) => nameKey(c.id) === key)?.id;
  }

  /** Hand the current user cores to the catalogue, so searches and evaluations see them. */
  async refresh(): Promise<void> {
    this.catalogue.setUserCores((await this.repo.listCurrent(false)).map((r) => r.shape));
  }

  async list(role: Role) {
    const shipped = this.catalogue.shippedCores().map((c) => listed(c, 'shipped', role));
    const user = (await this.repo.listCurrentWithAuthors()).map((row) => listedUserCore(row, role));
    return [...shipped, ...user];
  }

  /** A core by id for calculations: shipped first, then current user cores that are not retired. */
  core(id: string): Promise<CoreShape> {
    return coreById(this.catalogue, this.repo, id);
  }

  async history(id: number, role: Role) {
    return (await this.library.history(id)).map((row) => listedUserCore(row, role));
  }

  async create(request: UserCoreRequest, actor: Actor) {
    const row = await this.library.create(columnsOf(request), actor);
    await this.refresh();
    return listedUserCore({ ...row, createdByName: actor.displayName }, actor.role);
  }

  async edit(id: number, request: UserCoreRequest, actor: Actor) {
    const row = await this.library.newVersion(id, actor, () => columnsOf(request));
    await this.refresh();
    return listedUserCore({ ...row, createdByName: actor.displayName }, actor.role);
  }

  async setRetired(id: number, retired: boolean, actor: Actor) {
    const row = await this.library.setRetired(id, retired, actor);
    await this.refresh();
    return listedUserCore({ ...row, createdByName: null }, actor.role);
  }

  template(): string {
    return stringifyCsvTable(CORE_TEMPLATE_ROWS, CORE_CSV_COLUMNS);
  }

  preview(file: UploadedFile) {
    return this.csv.preview(file);
  }

  /** All or nothing, in one transaction: any row problem or missing decision refuses the whole file. */
  async commit(file: UploadedFile, rawDecisions: unknown, actor: Actor) {
    const { ids, ...result } = await this.csv.commit(file, rawDecisions, actor);
    await this.refresh();
    return { ...result, coreIds: ids };
  }
}
