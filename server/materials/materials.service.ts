import type { Role } from '@shared/schemas/auth';
import type { LibraryMaterial, MaterialData } from '@shared/schemas/material-answers';
import type { MaterialReadColumn } from '@shared/schemas/material-csv';
import type { MaterialEdit } from '@shared/schemas/material-requests';
import { materialCellsFromValues, validateMaterialCells, type MaterialValues } from '@shared/schemas/material-values';
import { may } from '@shared/api/permissions';
import type { AuditService } from '../audit/audit.service.ts';
import type { Actor } from '../http/access.ts';
import type { UploadedFile } from '../http/csv-upload.ts';
import { badRequest } from '../http/errors.ts';
import { LossPointsRepository } from '../loss-points/loss-points.repository.ts';
import { LibraryImport } from '../library/library-import.ts';
import { recordActions } from '../library/record-actions.ts';
import type { WithAuthor } from '../library/version-store.ts';
import { VersionedLibrary } from '../library/versioned-library.ts';
import { MATERIAL_TABLE, stringifyMaterialCsv } from './material-csv.ts';
import { materialData } from './material-data.ts';
import { TEMPLATE_ROWS } from './material-template.ts';
import { toMaterialSummary } from './material-view.ts';
import type { MaterialRow, MaterialsRepository } from './materials.repository.ts';

/** A stored version's own values, without identity and bookkeeping. */
export function valuesOf(row: MaterialRow): MaterialValues {
  const { id: _id, lineage: _l, version: _v, current: _c, retired: _r, importId: _i, createdBy: _b, createdAt: _a, ...values } = row;
  return values;
}

/** A stored version as the library answers it, with what a user of `role` may do with it. */
export function materialDetail(row: WithAuthor<MaterialRow>, role: Role, data: MaterialData): LibraryMaterial {
  return {
    ...toMaterialSummary(row),
    current: row.current,
    createdBy: row.createdByName,
    cells: materialCellsFromValues(valuesOf(row)),
    ...data,
    ...recordActions(role, row),
  };
}

/** The material library: a versioned library of material rows, filled from CSV files or edited a row at a time. */
export class MaterialsService {
  readonly library: VersionedLibrary<MaterialRow, MaterialValues>;
  private readonly csv: LibraryImport<MaterialRow, MaterialValues, MaterialReadColumn, MaterialValues>;

  constructor(
    private readonly repo: MaterialsRepository,
    audit: AuditService,
    private readonly lossPoints = new LossPointsRepository(repo.db),
  ) {
    this.library = new VersionedLibrary({ store: repo.versions, audit, words: { noun: 'material', label: 'material' } });
    this.csv = new LibraryImport<MaterialRow, MaterialValues, MaterialReadColumn, MaterialValues>(this.library, {
      table: MATERIAL_TABLE,
      validate: validateMaterialCells,
      columnsOf: (values) => values,
      // A material row uploaded again as a new version keeps the loss points of the version it replaces.
      carry: (tx, replaced) => this.lossPoints.copyMany(tx, replaced),
    });
  }

  /** Versions as the library answers them, with their loss-point figures read for all of them at once. */
  async details(rows: readonly WithAuthor<MaterialRow>[], role: Role): Promise<LibraryMaterial[]> {
    const data = await materialData(this.lossPoints, rows);
    return rows.map((row) => materialDetail(row, role, data.get(row.id)!));
  }

  async list(role: Role) {
    const materials = await this.details(await this.repo.versions.listCurrentWithAuthors(), role);
    return { materials, canImport: may(role, 'upload') };
  }

  async history(id: number, role: Role) {
    return this.details(await this.library.history(id), role);
  }

  async imports() {
    return (await this.repo.listImports()).map(({ entry, uploadedByName }) => ({
      id: entry.id,
      fileName: entry.fileName,
      uploadedBy: uploadedByName,
      uploadedAt: entry.uploadedAt.toISOString(),
      rowCount: entry.rowCount,
      createdCount: entry.createdCount,
      versionedCount: entry.versionedCount,
      skippedCount: entry.skippedCount,
    }));
  }

  template(): string {
    return stringifyMaterialCsv(TEMPLATE_ROWS);
  }

  async exportCsv(ids?: number[]): Promise<string> {
    const rows = ids ? await this.repo.findByIds(ids) : await this.repo.listCurrent(true);
    if (ids && rows.length !== new Set(ids).size) throw badRequest('Some material ids do not exist.', { ids: 'Unknown material id' });
    return stringifyMaterialCsv(rows.sort((a, b) => a.name.localeCompare(b.name)).map((r) => materialCellsFromValues(valuesOf(r))));
  }

  preview(file: UploadedFile) {
    return this.csv.preview(file);
  }

  /** All or nothing; the upload is logged (who, which file, what it did) and each new version points at its log entry. */
  async commit(file: UploadedFile, rawDecisions: unknown, actor: Actor) {
    const {
      ids,
      fileName: _f,
      ...result
    } = await this.csv.commit(file, rawDecisions, actor, async (tx, summary) => {
      const entry = await this.repo.insertImport(tx, {
        fileName: summary.fileName,
        uploadedBy: actor.id,
        rowCount: summary.rowCount,
        createdCount: summary.created,
        versionedCount: summary.versioned,
        skippedCount: summary.skipped,
      });
      return { importId: entry.id };
    });
    return { ...result, materialIds: ids };
  }

  /** An edit makes a new version from the changed cells; designs keep the id of the version they used. */
  async edit(id: number, edit: MaterialEdit, actor: Actor) {
    const inserted = await this.library.newVersion(
      id,
      actor,
      (row) => {
        const before = materialCellsFromValues(valuesOf(row));
        const cells: Record<string, string> = { ...before };
        for (const [column, value] of Object.entries(edit)) if (value !== undefined) cells[column] = String(value);
        const { values, problems } = validateMaterialCells(cells);
        if (!values) {
          const shown = problems.map((p) => p.message).slice(0, 3);
          throw badRequest(`The edit is not valid: ${shown.join('; ')}`, Object.fromEntries(problems.map((p) => [p.column, p.message])));
        }
        if (JSON.stringify(materialCellsFromValues(values)) === JSON.stringify(before)) {
          throw badRequest('The edit changes nothing; no new version was made.', { '(body)': 'Nothing changed' });
        }
        return values;
      },
      // The loss points stay with the material: the new version carries a copy of the edited one's.
      { within: (tx, inserted, previous) => this.lossPoints.copy(tx, previous.id, inserted.id) },
    );
    const [detail] = await this.details([{ ...inserted, createdByName: actor.displayName }], actor.role);
    return detail!;
  }

  async setRetired(id: number, retired: boolean, actor: Actor) {
    const row = await this.library.setRetired(id, retired, actor);
    const [detail] = await this.details([{ ...row, createdByName: null }], actor.role);
    return detail!;
  }
}
