import { asc, eq, sql } from 'drizzle-orm';
import type { LossPoint } from '@shared/fitting/loss-points';
import type { Db, Tx } from '../db/client.ts';
import { materialLossPoints } from '../db/schema.ts';

type PointRow = typeof materialLossPoints.$inferSelect;
/** What a point measured, without its bias and source. */
export type Measured = Pick<LossPoint, 'frequency' | 'peakFlux' | 'temperature' | 'lossDensity'>;

function toPoint(row: PointRow): LossPoint {
  return {
    frequency: row.frequency,
    peakFlux: row.peakFlux,
    temperature: row.temperature,
    lossDensity: row.lossDensity,
    ...(row.dcBias !== null ? { dcBias: row.dcBias } : {}),
    ...(row.source !== null ? { source: row.source } : {}),
  };
}

/** The loss points of material versions: read in file order, written in bulk, copied to a new version. */
export class LossPointsRepository {
  constructor(private readonly db: Db) {}

  async list(materialId: number, tx: Tx | Db = this.db): Promise<LossPoint[]> {
    const rows = await tx
      .select()
      .from(materialLossPoints)
      .where(eq(materialLossPoints.materialId, materialId))
      .orderBy(asc(materialLossPoints.position));
    return rows.map(toPoint);
  }

  /**
   * The measured values of the points of many versions, by version, in one statement (the library lists them all);
   * versions without points are absent.
   */
  async measuredOf(materialIds: readonly number[]): Promise<Map<number, Measured[]>> {
    const byVersion = new Map<number, Measured[]>();
    if (!materialIds.length) return byVersion;
    const t = materialLossPoints;
    const rows = await this.db
      .select({
        materialId: t.materialId,
        frequency: t.frequency,
        peakFlux: t.peakFlux,
        temperature: t.temperature,
        lossDensity: t.lossDensity,
      })
      .from(t)
      .where(sql`${t.materialId} = any(${sql.param([...materialIds])}::integer[])`);
    for (const { materialId, ...point } of rows) {
      const list = byVersion.get(materialId);
      if (list) list.push(point);
      else byVersion.set(materialId, [point]);
    }
    return byVersion;
  }

  /**
   * All points of a version in one statement: each column as one array parameter through unnest, so 10,000 points
   * send six parameters instead of 60,000 (the same reason as `VersionStore.insertVersions`).
   */
  async insert(tx: Tx, materialId: number, points: readonly LossPoint[]): Promise<void> {
    if (!points.length) return;
    const t = materialLossPoints;
    await tx.execute(sql`
      insert into ${t} (${sql.identifier(t.materialId.name)}, ${sql.identifier(t.position.name)}, ${sql.identifier(t.frequency.name)},
        ${sql.identifier(t.peakFlux.name)}, ${sql.identifier(t.temperature.name)}, ${sql.identifier(t.lossDensity.name)},
        ${sql.identifier(t.dcBias.name)}, ${sql.identifier(t.source.name)})
      select ${materialId}::integer, * from unnest(
        ${sql.param(points.map((_, i) => i + 1))}::integer[],
        ${sql.param(points.map((p) => p.frequency))}::double precision[],
        ${sql.param(points.map((p) => p.peakFlux))}::double precision[],
        ${sql.param(points.map((p) => p.temperature))}::double precision[],
        ${sql.param(points.map((p) => p.lossDensity))}::double precision[],
        ${sql.param(points.map((p) => p.dcBias ?? null))}::double precision[],
        ${sql.param(points.map((p) => p.source ?? null))}::varchar(200)[])`);
  }

  /** The points of one version given to another (a new version made from it), in the same order. */
  copy(tx: Tx, fromMaterialId: number, toMaterialId: number): Promise<void> {
    return this.copyMany(tx, [{ from: fromMaterialId, to: toMaterialId }]);
  }

  /** The points of each `from` version given to its `to` version, in one statement (a re-imported material file). */
  async copyMany(tx: Tx, pairs: readonly { from: number; to: number }[]): Promise<void> {
    if (!pairs.length) return;
    const t = materialLossPoints;
    await tx.execute(sql`
      insert into ${t} (material_id, position, frequency, peak_flux, temperature, loss_density, dc_bias, source)
      select pair.to_id, p.position, p.frequency, p.peak_flux, p.temperature, p.loss_density, p.dc_bias, p.source
      from ${t} p
      join unnest(${sql.param(pairs.map((x) => x.from))}::integer[], ${sql.param(pairs.map((x) => x.to))}::integer[]) as pair(from_id, to_id)
        on p.material_id = pair.from_id`);
  }
}
