// The shipped wire tables (core-data/wire/*.csv, values in mm), read once and validated,
// and the standard conductor options built from them.

import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import type { WireOption } from '@shared/engine/types';
import {
  type LitzConstruction,
  type MetricWireSize,
  type StandardWireSettings,
  type WireTables,
  standardWireOptions,
} from '@shared/catalogue/wire';
import { litzRowSchema, metricWireRowSchema } from '@shared/catalogue/wire-schema';
import { readCsvRecords, rowError } from './shipped-table';

const MM = 1e-3;

export function parseMetricWireRows(text: string, fileName: string): MetricWireSize[] {
  const records = readCsvRecords(text, fileName, Object.keys(metricWireRowSchema.shape));
  const sizes = records.map((record) => {
    const parsed = metricWireRowSchema.safeParse(record.cells);
    if (!parsed.success) throw rowError(fileName, record, parsed.error.issues);
    const row = parsed.data;
    return {
      nominalDiameter: row.nominal_mm * MM,
      grade1MaxDiameter: row.grade1_max_mm * MM,
      grade2MaxDiameter: row.grade2_max_mm * MM,
      source: row.source,
    };
  });
  sizes.forEach((size, index) => {
    const previous = sizes[index - 1];
    if (previous && !(size.nominalDiameter > previous.nominalDiameter)) {
      throw rowError(fileName, records[index]!, [
        { code: 'custom', path: ['nominal_mm'], message: 'sizes must be listed in increasing order without repeats', input: undefined },
      ]);
    }
  });
  return sizes;
}

export function parseLitzRows(text: string, fileName: string): LitzConstruction[] {
  const records = readCsvRecords(text, fileName, Object.keys(litzRowSchema.shape));
  return records.map((record) => {
    const parsed = litzRowSchema.safeParse(record.cells);
    if (!parsed.success) throw rowError(fileName, record, parsed.error.issues);
    const row = parsed.data;
    return {
      strandDiameter: row.strand_nominal_mm * MM,
      strandCount: row.strand_count,
      servingThickness: row.serving_mm * MM,
      source: row.source,
    };
  });
}

const WIRE_DIRECTORY = fileURLToPath(new URL('./wire/', import.meta.url));
let cachedTables: WireTables | undefined;

/** The IEC 60317 round-wire sizes and litz constructions shipped with the app (SI units). */
export function loadWireTables(): WireTables {
  cachedTables ??= Object.freeze({
    metric: Object.freeze(
      parseMetricWireRows(readFileSync(WIRE_DIRECTORY + 'iec60317-round.csv', 'utf8'), 'core-data/wire/iec60317-round.csv'),
    ),
    litz: Object.freeze(parseLitzRows(readFileSync(WIRE_DIRECTORY + 'litz.csv', 'utf8'), 'core-data/wire/litz.csv')),
  });
  return cachedTables;
}

/** standardWireOptions over the shipped tables. */
export function loadStandardWireOptions(settings?: StandardWireSettings): WireOption[] {
  return standardWireOptions(loadWireTables(), settings);
}
