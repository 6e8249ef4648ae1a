import {
  MATERIAL_CSV_COLUMNS,
  MATERIAL_READ_COLUMNS,
  REQUIRED_MATERIAL_COLUMNS,
  type MaterialCsvColumn,
  type MaterialReadColumn,
} from '@shared/schemas/material-csv';
import { mixedForms } from '@shared/schemas/material-old-columns';
import { parseCsvTable, stringifyCsvTable, type CsvRecord, type CsvTableFormat } from '../http/csv-table.ts';

// The unit tests of the material format read uploads through this module.
export { decodeCsvText } from '../http/csv-table.ts';

export const MAX_MATERIAL_ROWS = 10_000;

/**
 * The material file: its columns (the previous format version's too, converted on import; a header may not mix the
 * old and the new columns of one quantity), the ones the header must have, and the row limit.
 */
export const MATERIAL_TABLE: CsvTableFormat<MaterialReadColumn> = {
  columns: MATERIAL_READ_COLUMNS,
  required: REQUIRED_MATERIAL_COLUMNS,
  conflicts: mixedForms,
  noun: 'material',
  maxRows: MAX_MATERIAL_ROWS,
};

/** Header, delimiter and size checks, then one record per data row with its row number. */
export function parseMaterialCsv(text: string): CsvRecord<MaterialReadColumn>[] {
  return parseCsvTable(text, MATERIAL_TABLE);
}

/** CSV text of rows in template column order; formula-like cells are escaped for spreadsheets. */
export function stringifyMaterialCsv(rows: Record<MaterialCsvColumn, string>[]): string {
  return stringifyCsvTable(rows, MATERIAL_CSV_COLUMNS);
}
