import { performance } from 'node:perf_hooks';
import { MATERIAL_CSV_COLUMNS } from '@shared/schemas/materials';
import { AuditRepository } from '../../server/audit/audit.repository.ts';
import { AuditService } from '../../server/audit/audit.service.ts';
import { MaterialsRepository } from '../../server/materials/materials.repository.ts';
import { MaterialsService } from '../../server/materials/materials.service.ts';
import { withBenchDatabase } from './bench-database.ts';
import type { BenchRow } from './engine.ts';

const ROWS = 10_000;
const TARGET_SECONDS = 2;
const DATABASE = 'gapwright_bench_materials';

/** 10,000 invented materials, alternating unit sets, as one CSV file. */
function inventedCsv(): Buffer {
  const lines = [MATERIAL_CSV_COLUMNS.join(',')];
  for (let i = 0; i < ROWS; i++) {
    const si = i % 2 === 0;
    const cells: Record<string, string> = {
      name: `Bench material ${i} (invented)`,
      family: i % 5 === 0 ? 'powder' : 'ferrite',
      unit_set: si ? 'W/m3-Hz-T' : 'mW/cm3-kHz-mT',
      k: si ? String(2 + (i % 7) / 10) : String(0.002 + (i % 7) / 10000),
      alpha: String(1.2 + (i % 6) / 20),
      beta: String(2.3 + (i % 8) / 20),
      f_min: si ? '20000' : '20',
      f_max: si ? '500000' : '500',
      b_min: si ? '0.01' : '10',
      b_max: si ? '0.3' : '300',
      bsat_25: si ? '0.5' : '500',
      bsat_100: si ? '0.4' : '400',
      mu_i: String(1000 + i),
      density: '4800',
      provenance: 'Invented for the import benchmark',
    };
    lines.push(MATERIAL_CSV_COLUMNS.map((c) => cells[c] ?? '').join(','));
  }
  return Buffer.from(`${lines.join('\n')}\n`);
}

/** A 10,000-row material CSV validated (preview) and committed in one transaction, on its own database. */
export async function runImportBench(): Promise<BenchRow[]> {
  return withBenchDatabase(DATABASE, async (db, actor) => {
    const service = new MaterialsService(new MaterialsRepository(db), new AuditService(new AuditRepository(db)));
    const file = { originalname: 'bench.csv', buffer: inventedCsv() };

    const previewStart = performance.now();
    const preview = await service.preview(file);
    const previewSeconds = (performance.now() - previewStart) / 1000;
    const commitStart = performance.now();
    const result = await service.commit(file, {}, actor);
    const commitSeconds = (performance.now() - commitStart) / 1000;
    const verdict = (s: number) => (s <= TARGET_SECONDS ? `within the ${TARGET_SECONDS} s target` : `OVER the ${TARGET_SECONDS} s target`);
    return [
      {
        name: `material CSV preview (${ROWS.toLocaleString('en')} rows, ${(file.buffer.length / 1024).toFixed(0)} KiB)`,
        value: `${previewSeconds.toFixed(2)} s, ${preview.summary.errors} errors`,
      },
      {
        name: `material CSV validate + commit (${ROWS.toLocaleString('en')} rows)`,
        value: `${commitSeconds.toFixed(2)} s, ${result.created} created — ${verdict(commitSeconds)}`,
      },
    ];
  });
}

if (import.meta.url === `file://${process.argv[1]}`) {
  for (const row of await runImportBench()) process.stdout.write(`${row.name}: ${row.value}\n`);
}
