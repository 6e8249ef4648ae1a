// Migration 0010 converts material versions stored with the engine's constants (ct0, ct1, ct2; roll_off_a, b, c) to
// the named parameters. The migrations before it run in a schema of their own, old-form rows are inserted, then 0010
// runs and its results are compared with the conversions the server uses (shared/fitting). Every row is invented.
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import pg from 'pg';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { rollOffFraction } from '@shared/fitting/rolloff-fit';
import { behaviourFromQuadratic } from '@shared/fitting/temperature-fit';
import { MIGRATIONS_FOLDER } from '../../server/db/migrate.ts';
import { testDatabaseUrl } from './support/test-app.ts';

const SCHEMA = 'migration_0010_check';
const NAMED = '0010_material_named_parameters.sql';

let pool: pg.Pool;
let client: pg.PoolClient;

/** The statements of one migration file, with the schema left to the search path. */
async function run(file: string): Promise<void> {
  const text = readFileSync(join(MIGRATIONS_FOLDER, file), 'utf8').replaceAll('"public".', '');
  for (const statement of text.split('--> statement-breakpoint')) if (statement.trim()) await client.query(statement);
}

interface Stored {
  name: string;
  lowest_loss_temperature: number | null;
  lowest_loss_factor: number | null;
  loss_curvature: number | null;
  roll_off_half_field: number | null;
  roll_off_steepness: number | null;
  permeability: number;
  provenance: string;
}
let rows: Map<string, Stored>;

// [name, ct0, ct1, ct2, max_temperature, roll_off a, b, c, permeability]
type OldRow = [string, number | null, number | null, number | null, number | null, number | null, number | null, number | null, number];
const OLD_ROWS: OldRow[] = [
  ['upward', 1.43, 0.018, 1e-4, null, null, null, null, 2300],
  ['flat', 1.2, 0, 0, null, null, null, null, 2300],
  ['downward', 1, 0, -1e-5, 150, null, null, null, 2300],
  ['slope', 1.7, 0.01, 0, null, null, null, null, 2300],
  ['none', null, null, null, null, null, null, null, 2300],
  ['powder a = 1', null, null, null, null, 1, 5000 ** -1.8, 1.8, 60],
  ['powder a ≠ 1', null, null, null, null, 1.25, 2e-7, 1.6, 60],
];

beforeAll(async () => {
  pool = new pg.Pool({ connectionString: testDatabaseUrl(), max: 1 });
  client = await pool.connect();
  await client.query(`drop schema if exists ${SCHEMA} cascade`);
  await client.query(`create schema ${SCHEMA}`);
  await client.query(`set search_path to ${SCHEMA}`);
  const files = readdirSync(MIGRATIONS_FOLDER)
    .filter((f) => f.endsWith('.sql'))
    .sort();
  expect(files).toContain(NAMED);
  for (const file of files.filter((f) => f < NAMED)) await run(file);
  for (const [name, ct0, ct1, ct2, maxTemperature, a, b, c, permeability] of OLD_ROWS) {
    await client.query(
      `insert into materials (lineage, version, name, family, unit_set, k_uploaded, k, alpha, beta, fit_frequency_min,
         fit_frequency_max, fit_flux_min, fit_flux_max, ct0, ct1, ct2, max_temperature, bsat_25, bsat_100, permeability,
         roll_off_a, roll_off_b, roll_off_c, density, provenance)
       values ($1, 1, $1, 'ferrite', 'W/m3-Hz-T', 3, 3, 1.4, 2.6, 5e4, 3e5, 0.02, 0.25, $2, $3, $4, $5, 0.5, 0.4, $6, $7, $8, $9, 4800,
         'Invented old row')`,
      [name, ct0, ct1, ct2, maxTemperature, permeability, a, b, c],
    );
  }
  await run(NAMED);
  const result = await client.query<Stored>(
    `select name, lowest_loss_temperature, lowest_loss_factor, loss_curvature, roll_off_half_field, roll_off_steepness,
       permeability, provenance from materials`,
  );
  rows = new Map(result.rows.map((r) => [r.name, r]));
});

afterAll(async () => {
  await client?.query(`drop schema if exists ${SCHEMA} cascade`);
  client?.release();
  await pool?.end();
});

describe('migration 0010: stored temperature quadratics', () => {
  it('drops the old columns', async () => {
    const columns = await client.query(
      `select column_name from information_schema.columns where table_schema = $1 and table_name = 'materials'`,
      [SCHEMA],
    );
    const names = columns.rows.map((r: { column_name: string }) => r.column_name);
    expect(names).toEqual(expect.arrayContaining(['lowest_loss_temperature', 'roll_off_half_field']));
    for (const old of ['ct0', 'ct1', 'ct2', 'roll_off_a', 'roll_off_b', 'roll_off_c']) expect(names).not.toContain(old);
  });

  it('holds the named parameters positive from then on', async () => {
    await expect(client.query(`update materials set lowest_loss_factor = 0 where name = 'upward'`)).rejects.toThrow(
      /materials_loss_factor_check/,
    );
    await expect(client.query(`update materials set roll_off_steepness = -1 where name = 'powder a = 1'`)).rejects.toThrow(
      /materials_roll_off_check/,
    );
  });

  it('converts an upward parabola exactly, as behaviourFromQuadratic does (algebra, no source)', () => {
    const expected = behaviourFromQuadratic({ ct0: 1.43, ct1: 0.018, ct2: 1e-4 });
    const row = rows.get('upward')!;
    expect(row.lowest_loss_temperature).toBeCloseTo(expected.lowestLossTemperature, 9);
    expect(row.lowest_loss_factor).toBeCloseTo(expected.lowestLossFactor, 12);
    expect(row.loss_curvature).toBe(expected.curvature);
    expect(row.provenance).toBe('Invented old row');
  });

  it('takes a flat factor with T0 = 25 °C and c = 0', () => {
    const row = rows.get('flat')!;
    expect([row.lowest_loss_temperature, row.lowest_loss_factor, row.loss_curvature]).toEqual([25, 1.2, 0]);
  });

  it('replaces a quadratic that is not positive everywhere by its mean over −40 °C … max_temperature, and says so', () => {
    // Mean by the trapezoid rule on 1 K steps (numerical check of the closed form in the migration).
    const mean = (q: { ct0: number; ct1: number; ct2: number }, upper: number) => {
      const f = (t: number) => q.ct2 * t * t - q.ct1 * t + q.ct0;
      let sum = 0;
      for (let t = -40; t < upper; t++) sum += (f(t) + f(t + 1)) / 2;
      return sum / (upper + 40);
    };
    const downward = rows.get('downward')!;
    // 1 − 1e-5·T² over −40…150 °C: 1 − 1e-5·(150² − 40·150 + 1600)/3 = 0.9397 (by hand).
    expect(downward.lowest_loss_factor).toBeCloseTo(mean({ ct0: 1, ct1: 0, ct2: -1e-5 }, 150), 4);
    expect(downward.lowest_loss_factor).toBeCloseTo(0.939667, 5);
    expect([downward.lowest_loss_temperature, downward.loss_curvature]).toEqual([25, 0]);
    expect(downward.provenance).toBe('Invented old row [temperature behaviour converted approximately from an old quadratic]');
    // 1.7 − 0.01·T over −40…200 °C (no max_temperature): 1.7 − 0.01·80 = 0.9.
    expect(rows.get('slope')!.lowest_loss_factor).toBeCloseTo(0.9, 12);
    expect(rows.get('none')!.lowest_loss_factor).toBeNull();
    expect(rows.get('none')!.provenance).toBe('Invented old row');
  });
});

describe('migration 0010: stored roll-off constants', () => {
  it('converts a = 1 exactly: H½ = b^(−1/c), n = c, μi unchanged', () => {
    const row = rows.get('powder a = 1')!;
    expect(row.roll_off_half_field).toBeCloseTo(5000, 6);
    expect(row.roll_off_steepness).toBe(1.8);
    expect(row.permeability).toBe(60);
  });

  it('keeps the curve of a ≠ 1 exactly with μi divided by a (algebra, no source)', () => {
    const row = rows.get('powder a ≠ 1')!;
    expect(row.permeability).toBeCloseTo(48, 12);
    const rollOff = { halfField: row.roll_off_half_field!, steepness: row.roll_off_steepness! };
    for (const field of [100, 3000, 20000, 1e5]) {
      expect(row.permeability * rollOffFraction(rollOff, field)).toBeCloseTo(60 / (1.25 + 2e-7 * field ** 1.6), 9);
    }
    expect(rows.get('upward')!.roll_off_half_field).toBeNull();
  });
});
