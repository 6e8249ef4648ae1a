import { MATERIAL_CSV_COLUMNS, REQUIRED_MATERIAL_COLUMNS, type MaterialCsvColumn } from '@shared/schemas/material-csv';
import { parseCsvTable, stringifyCsvTable, type CsvRecord, type CsvTableFormat } from '../http/csv-table.ts';

// The unit tests of the material format read uploads through this module.
export { decodeCsvText } from '../http/csv-table.ts';

export const MAX_MATERIAL_ROWS = 10_000;

/** The material file: its columns, the ones the header must have, and the row limit. */
export const MATERIAL_TABLE: CsvTableFormat<MaterialCsvColumn> = {
  columns: MATERIAL_CSV_COLUMNS,
  required: REQUIRED_MATERIAL_COLUMNS,
  noun: 'material',
  maxRows: MAX_MATERIAL_ROWS,
};

/** Header, delimiter and size checks, then one record per data row with its row number. */
export function parseMaterialCsv(text: string): CsvRecord<MaterialCsvColumn>[] {
  return parseCsvTable(text, MATERIAL_TABLE);
}

/** CSV text of rows in template column order; formula-like cells are escaped for spreadsheets. */
export function stringifyMaterialCsv(rows: Record<MaterialCsvColumn, string>[]): string {
  return stringifyCsvTable(rows, MATERIAL_CSV_COLUMNS);
}
