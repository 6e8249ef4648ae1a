import {
  importDecisionsSchema,
  materialCellsFromValues,
  validateMaterialCells,
  type ImportDecision,
  type ImportPreview,
  type LibraryMaterial,
  type MaterialEdit,
  type MaterialValues,
} from '@shared/schemas/materials';
import type { AuditService } from '../audit/audit.service.ts';
import type { Actor } from '../http/access.ts';
import { analyseRecords, decodeCsvText, rowErrors, summarisePreview, undecidedNames, type RowAnalysis } from '../http/csv-table.ts';
import type { UploadedFile } from '../http/csv-upload.ts';
import { badRequest, conflict, notFound } from '../http/errors.ts';
import { nameKey, sameName } from '../http/name-key.ts';
import { parseWith } from '../http/validate.ts';
import { parseMaterialCsv, stringifyMaterialCsv } from './material-csv.ts';
import { TEMPLATE_ROWS } from './material-template.ts';
import { toMaterialSummary } from './material-view.ts';
import type { MaterialRow, MaterialsRepository, MaterialWithAuthor, Tx } from './materials.repository.ts';

type Analysis = RowAnalysis<MaterialValues, MaterialRow>;

export function lineageSlug(name: string): string {
  return (
    name
      .toLowerCase()
      .replace(/[^a-z0-9]+/g, '-')
      .replace(/^-|-$/g, '')
      .slice(0, 70) || 'material'
  );
}

function uniqueLineage(name: string, taken: Set<string>): string {
  const base = lineageSlug(name);
  let lineage = base;
  for (let n = 2; taken.has(lineage); n++) lineage = `${base}-${n}`;
  taken.add(lineage);
  return lineage;
}

function valuesOf(row: MaterialRow): MaterialValues {
  const { id: _id, lineage: _l, version: _v, current: _c, retired: _r, importId: _i, createdBy: _b, createdAt: _a, ...values } = row;
  return values;
}

export function materialDetail(row: MaterialWithAuthor): LibraryMaterial {
  return { ...toMaterialSummary(row), current: row.current, createdBy: row.createdByName, cells: materialCellsFromValues(valuesOf(row)) };
}

/** The rows of a file checked one by one, against each other and against the library. */
function analyse(fileBuffer: Buffer, existing: Map<string, MaterialRow>): Analysis {
  const records = parseMaterialCsv(decodeCsvText(fileBuffer));
  // A row whose name is the same name as a stored one (look-alike letters, invisible characters) is that material.
  const byKey = new Map([...existing.values()].map((r) => [nameKey(r.name), r]));
  return analyseRecords(records, validateMaterialCells, (lowerName) => byKey.get(nameKey(lowerName)));
}

export class MaterialsService {
  constructor(
    private readonly repo: MaterialsRepository,
    private readonly audit: AuditService,
  ) {}

  async list() {
    return (await this.repo.listWithAuthors()).map(materialDetail);
  }

  async history(id: number) {
    const row = await this.repo.findById(id);
    if (!row) throw notFound(`No material with id ${id}.`);
    return (await this.repo.history(row.lineage)).map(materialDetail);
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

  async preview(file: UploadedFile): Promise<ImportPreview> {
    const analysis = analyse(file.buffer, await this.repo.currentByLowerName());
    return summarisePreview(file.originalname, analysis.rows);
  }

  /** All or nothing: any row problem or missing decision refuses the whole file. */
  async commit(file: UploadedFile, rawDecisions: unknown, actor: Actor) {
    const decisions = parseWith(importDecisionsSchema, rawDecisions ?? {});
    const byLowerName = new Map(Object.entries(decisions).map(([name, d]) => [name.trim().toLowerCase(), d] as [string, ImportDecision]));
    const result = await this.repo.db.transaction(async (tx) => {
      const analysis = analyse(file.buffer, await this.repo.currentByLowerName(tx));
      if (analysis.rows.some((r) => r.status === 'error')) throw rowErrors(analysis.rows);
      const undecided = undecidedNames(analysis.valid, (lowerName) => byLowerName.has(lowerName));
      if (undecided) throw undecided;
      const written = await this.write(tx, file, analysis, byLowerName, actor);
      await this.audit.record(
        {
          actorId: actor.id,
          action: 'materials.imported',
          target: file.originalname.slice(0, 200),
          details: { importId: written.importId, created: written.created, versioned: written.versioned, skipped: written.skipped },
        },
        tx,
      );
      return written;
    });
    return result;
  }

  private async write(tx: Tx, file: UploadedFile, analysis: Analysis, decisions: Map<string, ImportDecision>, actor: Actor) {
    const taken = await this.repo.lineages(tx);
    const toInsert = [];
    const superseded: number[] = [];
    let created = 0;
    let versioned = 0;
    let skipped = 0;
    for (const { values, existing } of analysis.valid) {
      if (existing) {
        if (decisions.get(values.name.toLowerCase()) === 'skip') {
          skipped++;
          continue;
        }
        superseded.push(existing.id);
        toInsert.push({ ...values, lineage: existing.lineage, version: existing.version + 1 });
        versioned++;
      } else {
        toInsert.push({ ...values, lineage: uniqueLineage(values.name, taken), version: 1 });
        created++;
      }
    }
    const entry = await this.repo.insertImport(tx, {
      fileName: file.originalname.slice(0, 200) || 'upload.csv',
      uploadedBy: actor.id,
      rowCount: analysis.rows.length,
      createdCount: created,
      versionedCount: versioned,
      skippedCount: skipped,
    });
    await this.repo.retireCurrentVersions(tx, superseded);
    const inserted = await this.repo.insertVersions(
      tx,
      toInsert.map((r) => ({ ...r, importId: entry.id, createdBy: actor.id })),
    );
    return { importId: entry.id, created, versioned, skipped, materialIds: inserted };
  }

  /** An edit makes a new version; designs keep the id of the version they used. */
  async edit(id: number, edit: MaterialEdit, actor: Actor) {
    const result = await this.repo.db.transaction(async (tx) => {
      const existing = await this.repo.currentByLowerName(tx);
      const row = [...existing.values()].find((r) => r.id === id);
      if (!row) {
        if (await this.repo.findById(id))
          throw conflict('Only the current version of a material can be edited.', { id: 'Not the current version' });
        throw notFound(`No material with id ${id}.`);
      }
      const cells: Record<string, string> = { ...materialCellsFromValues(valuesOf(row)) };
      for (const [column, value] of Object.entries(edit)) if (value !== undefined) cells[column] = String(value);
      const { values, problems } = validateMaterialCells(cells);
      if (!values) {
        const fields = Object.fromEntries(problems.map((p) => [p.column, p.message]));
        throw badRequest(
          `The edit is not valid: ${problems
            .map((p) => p.message)
            .slice(0, 3)
            .join('; ')}`,
          fields,
        );
      }
      if (JSON.stringify(materialCellsFromValues(values)) === JSON.stringify(materialCellsFromValues(valuesOf(row)))) {
        throw badRequest('The edit changes nothing; no new version was made.', { '(body)': 'Nothing changed' });
      }
      const clash = sameName(existing.values(), values.name, (r) => r.id === row.id);
      if (clash)
        throw conflict(`Another material is already called "${clash.name}" (the same name as "${values.name}").`, {
          name: `Same name as "${clash.name}"`,
        });
      await this.repo.retireCurrentVersions(tx, [row.id]);
      const [insertedId] = await this.repo.insertVersions(tx, [
        { ...values, lineage: row.lineage, version: row.version + 1, retired: row.retired, importId: null, createdBy: actor.id },
      ]);
      const inserted = (await this.repo.findById(insertedId!, tx))!;
      await this.audit.record(
        { actorId: actor.id, action: 'material.edited', target: inserted.name, details: { id: inserted.id, version: inserted.version } },
        tx,
      );
      return inserted;
    });
    return materialDetail({ ...result, createdByName: actor.displayName });
  }

  async setRetired(id: number, retired: boolean, actor: Actor) {
    const row = await this.repo.db.transaction(async (tx) => {
      const changed = await this.repo.setRetired(id, retired, tx);
      if (!changed) {
        if (await this.repo.findById(id, tx))
          throw conflict('Only the current version of a material can be retired or restored.', { id: 'Not the current version' });
        throw notFound(`No material with id ${id}.`);
      }
      await this.audit.record(
        { actorId: actor.id, action: retired ? 'material.retired' : 'material.unretired', target: changed.name, details: { id } },
        tx,
      );
      return changed;
    });
    return materialDetail({ ...row, createdByName: null });
  }
}
