import { DESIGN_FILE_FORMAT, type ExportKind } from '@shared/schemas/designs';
import type { CalcService } from '../calc/calc.service.ts';
import type { DesignMaterials } from '../designs/design-materials.ts';
import type { DesignsService } from '../designs/designs.service.ts';
import { requireStoredResult } from '../designs/stored-result.ts';
import { buildBom } from './bom.ts';
import { bomCsv, candidatesCsv } from './candidates-csv.ts';
import { buildSpiceSubcircuit } from './spice.ts';

export interface ExportFile {
  fileName: string;
  contentType: string;
  body: string;
}

export class ExportsService {
  constructor(
    private readonly designs: DesignsService,
    private readonly materials: DesignMaterials,
    private readonly calc: CalcService,
  ) {}

  async export(designId: number, revisionNumber: number, kind: ExportKind): Promise<ExportFile> {
    const revision = await this.designs.revision(designId, revisionNumber);
    const base = `${revision.design.number}-r${revision.revision}`;
    if (kind === 'design.json') {
      const file = {
        format: DESIGN_FILE_FORMAT,
        formatVersion: 1,
        number: revision.design.number,
        title: revision.design.title,
        revision: revision.revision,
        status: revision.status,
        engineVersion: revision.engineVersion,
        exportedAt: new Date().toISOString(),
        spec: revision.spec,
        construction: revision.construction,
        result: revision.result,
      };
      return {
        fileName: `${base}.design.json`,
        contentType: 'application/json; charset=utf-8',
        body: `${JSON.stringify(file, null, 2)}\n`,
      };
    }
    if (kind === 'candidates.csv') {
      const search = await this.calc.search({
        spec: revision.spec.converter,
        limits: revision.spec.limits,
        families: revision.spec.families,
        materialIds: await this.materials.searchIds(revision.spec),
        rankBy: 'smallest',
        offset: 0,
        // Every feasible candidate: the file is the whole ranked list, not a page of it.
        limit: Number.MAX_SAFE_INTEGER,
      });
      return {
        fileName: `${base}-candidates.csv`,
        contentType: 'text/csv; charset=utf-8',
        body: candidatesCsv(revision.design, search, await this.materials.names()),
      };
    }
    // The files of the figures as saved (a 409 when there are none, or they no longer read).
    const { evaluation } = requireStoredResult(`Revision ${revision.revision} of ${revision.design.number}`, revision);
    if (kind === 'bom.csv') {
      const names = await this.materials.names();
      const materialName = names.get(String(revision.materialId)) ?? evaluation.material.name;
      return {
        fileName: `${base}-bom.csv`,
        contentType: 'text/csv; charset=utf-8',
        body: bomCsv(buildBom({ result: evaluation, materialName })),
      };
    }
    const body = buildSpiceSubcircuit(
      {
        designNumber: revision.design.number,
        title: revision.design.title,
        revision: revision.revision,
        engineVersion: revision.engineVersion ?? 'unknown',
      },
      evaluation,
    );
    return { fileName: `${base}.lib`, contentType: 'text/plain; charset=utf-8', body };
  }
}
