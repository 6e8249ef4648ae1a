// The shipped core catalogue: one CSV table per family under core-data/cores/, values
// in the units the trade quotes (mm, mm², mm³), read once, validated row by row and
// converted to SI CoreShape records.

import { readFileSync } from 'node:fs';
import { basename } from 'node:path';
import { fileURLToPath } from 'node:url';
import type { CoreFamily, CoreShape } from '@shared/engine/types';
import {
  RING_CORE_COLUMNS,
  SHAPED_CORE_COLUMNS,
  coreShapeSchema,
  ringCoreRowSchema,
  shapedCoreRowSchema,
} from '@shared/catalogue/core-schema';
import {
  RING_CORE_FIELD_COLUMNS,
  SHAPED_CORE_FIELD_COLUMNS,
  ringCoreFromRow,
  shapedCoreFromRow,
} from '@shared/catalogue/core-rows';
import type { CentreLeg } from '@shared/catalogue/bobbin-estimate';
import { TableError, readCsvRecords, rowError } from './shipped-table';

export { TableError } from './shipped-table';

/** Table file name → core family it holds. */
export const CORE_TABLE_FILES: Readonly<Record<string, CoreFamily>> = {
  'e.csv': 'E',
  'etd.csv': 'ETD',
  'efd.csv': 'EFD',
  'pq.csv': 'PQ',
  'rm.csv': 'RM',
  'pot.csv': 'POT',
  'ring.csv': 'RING',
  'powder-toroid.csv': 'POWDER_TOROID',
};

/** Parses and validates one core table. `fileName` selects the family (see CORE_TABLE_FILES). */
export function parseCoreRows(text: string, fileName: string): CoreShape[] {
  const family = CORE_TABLE_FILES[basename(fileName)];
  if (!family) {
    throw new TableError(fileName, undefined, undefined, undefined, `unknown core table; expected one of ${Object.keys(CORE_TABLE_FILES).join(', ')}`);
  }
  const isRing = family === 'RING' || family === 'POWDER_TOROID';
  const records = readCsvRecords(text, fileName, isRing ? RING_CORE_COLUMNS : SHAPED_CORE_COLUMNS);
  const fieldColumns: Partial<Record<string, string>> = isRing ? RING_CORE_FIELD_COLUMNS : SHAPED_CORE_FIELD_COLUMNS;
  const derivedColumn = (field: string) => fieldColumns[field] ?? `${field} (derived)`;

  return records.map((record) => {
    let shape: CoreShape;
    if (isRing) {
      const parsed = ringCoreRowSchema.safeParse(record.cells);
      if (!parsed.success) throw rowError(fileName, record, parsed.error.issues);
      shape = ringCoreFromRow(parsed.data, family);
    } else {
      const parsed = shapedCoreRowSchema.safeParse(record.cells);
      if (!parsed.success) throw rowError(fileName, record, parsed.error.issues);
      shape = shapedCoreFromRow(parsed.data, family);
    }
    const validated = coreShapeSchema.safeParse(shape);
    if (!validated.success) throw rowError(fileName, record, validated.error.issues, derivedColumn);
    return shape;
  });
}

const CORE_TABLE_DIRECTORY = fileURLToPath(new URL('./cores/', import.meta.url));

/** Checks that designations are unique across all tables; names the second occurrence. */
export function assertUniqueCoreIds(tables: { fileName: string; cores: CoreShape[] }[]): void {
  const seen = new Map<string, string>();
  for (const { fileName, cores } of tables) {
    cores.forEach((core, index) => {
      const earlier = seen.get(core.id);
      if (earlier) {
        throw new TableError(fileName, index + 1, undefined, 'designation', `"${core.id}" is already used in ${earlier}`);
      }
      seen.set(core.id, fileName);
    });
  }
}

let cachedCatalogue: readonly CoreShape[] | undefined;

/** All shipped cores, validated and in SI units. Reads the tables on first call only. */
export function loadCoreCatalogue(): CoreShape[] {
  if (!cachedCatalogue) {
    const tables = Object.keys(CORE_TABLE_FILES).map((name) => {
      const fileName = `core-data/cores/${name}`;
      return { fileName, cores: parseCoreRows(readFileSync(CORE_TABLE_DIRECTORY + name, 'utf8'), fileName) };
    });
    assertUniqueCoreIds(tables);
    cachedCatalogue = Object.freeze(tables.flatMap((table) => table.cores).map((core) => Object.freeze(core)));
  }
  return [...cachedCatalogue];
}

let cachedCentreLegs: ReadonlyMap<string, CentreLeg> | undefined;

/**
 * The centre leg of every shipped shaped core (round or rectangular, m), by designation: what the field check needs
 * beyond the CoreShape to draw an E or EFD core's planar cross-section. Kept out of CoreShape (whose contract the
 * engine, the stored results and user cores share); read from the same validated rows on first call.
 */
export function loadCentreLegs(): ReadonlyMap<string, CentreLeg> {
  if (!cachedCentreLegs) {
    const legs = new Map<string, CentreLeg>();
    for (const [name, family] of Object.entries(CORE_TABLE_FILES)) {
      if (family === 'RING' || family === 'POWDER_TOROID') continue;
      const fileName = `core-data/cores/${name}`;
      for (const record of readCsvRecords(readFileSync(CORE_TABLE_DIRECTORY + name, 'utf8'), fileName, SHAPED_CORE_COLUMNS)) {
        const parsed = shapedCoreRowSchema.safeParse(record.cells);
        if (!parsed.success) throw rowError(fileName, record, parsed.error.issues);
        const row = parsed.data;
        legs.set(
          row.designation,
          row.centre_leg === 'round'
            ? { shape: 'round', diameter: row.centre_leg_width_mm * 1e-3 }
            : { shape: 'rect', width: row.centre_leg_width_mm * 1e-3, depth: (row.centre_leg_depth_mm ?? 0) * 1e-3 },
        );
      }
    }
    cachedCentreLegs = legs;
  }
  return cachedCentreLegs;
}
