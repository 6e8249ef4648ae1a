import { performance } from 'node:perf_hooks';
import { LOSS_POINT_CSV_COLUMNS } from '@shared/schemas/loss-point-csv';
import { AuditRepository } from '../../server/audit/audit.repository.ts';
import { AuditService } from '../../server/audit/audit.service.ts';
import { SearchPool } from '../../server/calc/search-pool.ts';
import { LossPointsRepository } from '../../server/loss-points/loss-points.repository.ts';
import { LossPointsService } from '../../server/loss-points/loss-points.service.ts';
import { MaterialsRepository } from '../../server/materials/materials.repository.ts';
import { MaterialsService } from '../../server/materials/materials.service.ts';
import { withBenchDatabase } from './bench-database.ts';
import type { BenchRow } from './engine.ts';

const TARGET_SECONDS = 2;
const DATABASE = 'gapwright_bench_loss_points';
// 25 frequencies × 20 flux levels × 20 temperatures = 10,000 points, the file limit.
const FREQUENCIES = Array.from({ length: 25 }, (_, i) => 20 + i * 20);
const FLUXES = Array.from({ length: 20 }, (_, i) => 10 + i * 10);
const TEMPERATURES = Array.from({ length: 20 }, (_, i) => 20 + i * 5);

/** Invented points: Pv = 4.5·f^1.35·B̂^2.7·(1 + 1.2e-4·(T − 85)²) with ±2 % ripple, in the file's units. */
function inventedCsv(): Buffer {
  const lines = [LOSS_POINT_CSV_COLUMNS.join(',')];
  let n = 0;
  for (const temperature of TEMPERATURES) {
    for (const kHz of FREQUENCIES) {
      for (const mT of FLUXES) {
        const ripple = 1 + 0.02 * Math.sin(n++);
        const loss = 4.5 * (kHz * 1e3) ** 1.35 * (mT * 1e-3) ** 2.7 * (1 + 1.2e-4 * (temperature - 85) ** 2) * ripple;
        lines.push(`${kHz},${mT},${temperature},${(loss / 1e3).toPrecision(6)},,invented for the bench`);
      }
    }
  }
  return Buffer.from(`${lines.join('\n')}\n`);
}

/**
 * A 10,000-point loss-point file previewed and committed on a demo material, then fitted, and the library listed with
 * it, on its own database.
 */
export async function runLossPointsBench(): Promise<BenchRow[]> {
  return withBenchDatabase(DATABASE, async (db, actor) => {
    const repository = new MaterialsRepository(db);
    const points = new LossPointsRepository(db);
    const materials = new MaterialsService(repository, new AuditService(new AuditRepository(db)), points);
    // The fit runs inline here (no worker threads), so its time is the fit's own.
    const service = new LossPointsService(materials, points, new SearchPool({ workers: 0, queue: 0, idleMs: 0, nice: 0 }));
    const [material] = await repository.listCurrent();
    const file = { originalname: 'bench-points.csv', buffer: inventedCsv() };

    // The library answer reads every listed version's points and rates its coefficients against them: once to warm up,
    // then the median of five, without points and with the file's.
    const time = async <T>(run: () => Promise<T> | T): Promise<[T, number]> => {
      const start = performance.now();
      const result = await run();
      return [result, (performance.now() - start) / 1000];
    };
    const libraryTime = async () => {
      await materials.list('engineer');
      const seconds: number[] = [];
      for (let i = 0; i < 5; i++) seconds.push((await time(() => materials.list('engineer')))[1]);
      return seconds.sort((a, b) => a - b)[2]!;
    };
    const libraryWithout = await libraryTime();
    const [preview, previewSeconds] = await time(() => service.preview(material!.id, file));
    const [commit, commitSeconds] = await time(() => service.commit(material!.id, file, actor));
    const [fit, fitSeconds] = await time(() => service.fit(commit.materialId, { mode: 'bands', maxWorstError: 0.05, temperature: true }));
    const libraryWith = await libraryTime();
    const total = previewSeconds + commitSeconds;
    const verdict = total <= TARGET_SECONDS ? `within the ${TARGET_SECONDS} s target` : `OVER the ${TARGET_SECONDS} s target`;
    const count = preview.summary.valid.toLocaleString('en');
    return [
      {
        name: `loss-point CSV preview (${count} points, ${(file.buffer.length / 1024).toFixed(0)} KiB)`,
        value: `${previewSeconds.toFixed(2)} s`,
      },
      { name: `loss-point CSV commit (${count} points, one transaction)`, value: `${commitSeconds.toFixed(2)} s` },
      { name: 'loss-point preview + commit', value: `${total.toFixed(2)} s — ${verdict}` },
      {
        name: `fit of ${count} points (bands ≤ 5 %, temperature)`,
        value: `${fitSeconds.toFixed(2)} s, ${fit.fits.length} band(s), worst ${(Math.max(...fit.fits.map((f) => f.worstRelativeError)) * 100).toFixed(1)} %`,
      },
      {
        name: `material library answer, no points → one version with ${count}`,
        value: `${(libraryWithout * 1000).toFixed(0)} ms → ${(libraryWith * 1000).toFixed(0)} ms (medians of 5)`,
      },
    ];
  });
}

if (import.meta.url === `file://${process.argv[1]}`) {
  for (const row of await runLossPointsBench()) process.stdout.write(`${row.name}: ${row.value}\n`);
}
