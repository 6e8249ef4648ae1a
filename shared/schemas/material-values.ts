// A material version's stored values (SI units: W/m³, Hz, T, kg/m³, °C) and their conversion from and to
// the cells of a CSV row in the row's own unit set.
import type { MaterialFamily } from '@shared/engine/types';
import type { CellProblem } from './csv-import';
import { cellProblems } from './csv-cells';
import {
  kToSi,
  MATERIAL_CSV_COLUMNS,
  materialCsvRowSchema,
  UNIT_SCALES,
  type MaterialCsvColumn,
  type MaterialCsvRow,
  type MaterialUnitSet,
} from './material-csv';

/** A material version as stored (SI units), without identity and bookkeeping. */
export interface MaterialValues {
  name: string;
  family: MaterialFamily;
  unitSet: MaterialUnitSet;
  kUploaded: number;
  k: number;
  alpha: number;
  beta: number;
  fitFrequencyMin: number;
  fitFrequencyMax: number;
  fitFluxMin: number;
  fitFluxMax: number;
  ct0: number | null;
  ct1: number | null;
  ct2: number | null;
  referenceTemperature: number | null;
  /** Highest tolerated hot-spot temperature (°C); null: the engine's default for the family. */
  maxTemperature: number | null;
  bsat25: number;
  bsat100: number;
  permeability: number;
  rollOffA: number | null;
  rollOffB: number | null;
  rollOffC: number | null;
  density: number;
  provenance: string;
}

export function materialValuesFromRow(row: MaterialCsvRow): MaterialValues {
  const scale = UNIT_SCALES[row.unit_set];
  return {
    name: row.name,
    family: row.family,
    unitSet: row.unit_set,
    kUploaded: row.k,
    k: kToSi(row.k, row.unit_set, row.alpha, row.beta),
    alpha: row.alpha,
    beta: row.beta,
    fitFrequencyMin: row.f_min * scale.frequency,
    fitFrequencyMax: row.f_max * scale.frequency,
    fitFluxMin: row.b_min * scale.flux,
    fitFluxMax: row.b_max * scale.flux,
    ct0: row.ct0 ?? null,
    ct1: row.ct1 ?? null,
    ct2: row.ct2 ?? null,
    referenceTemperature: row.t_ref ?? null,
    maxTemperature: row.max_temperature ?? null,
    bsat25: row.bsat_25 * scale.flux,
    bsat100: row.bsat_100 * scale.flux,
    permeability: row.mu_i,
    rollOffA: row.rolloff_a ?? null,
    rollOffB: row.rolloff_b ?? null,
    rollOffC: row.rolloff_c ?? null,
    density: row.density,
    provenance: row.provenance,
  };
}

/** Validate one row of cells (column → text); absent columns count as empty cells. */
export function validateMaterialCells(cells: Partial<Record<string, string>>): { values?: MaterialValues; problems: CellProblem[] } {
  const input: Record<string, string> = {};
  for (const column of MATERIAL_CSV_COLUMNS) input[column] = cells[column] ?? '';
  const result = materialCsvRowSchema.safeParse(input);
  if (!result.success) return { problems: cellProblems(result.error.issues) };
  return { values: materialValuesFromRow(result.data), problems: [] };
}

/** Cells of a stored version in its own unit set (for export and the edit form); the inverse of the import. */
export function materialCellsFromValues(values: MaterialValues): Record<MaterialCsvColumn, string> {
  const scale = UNIT_SCALES[values.unitSet];
  const text = (value: number | null) => (value === null ? '' : String(value));
  return {
    name: values.name,
    family: values.family,
    unit_set: values.unitSet,
    k: text(values.kUploaded),
    alpha: text(values.alpha),
    beta: text(values.beta),
    f_min: text(values.fitFrequencyMin / scale.frequency),
    f_max: text(values.fitFrequencyMax / scale.frequency),
    b_min: text(values.fitFluxMin / scale.flux),
    b_max: text(values.fitFluxMax / scale.flux),
    ct0: text(values.ct0),
    ct1: text(values.ct1),
    ct2: text(values.ct2),
    t_ref: text(values.referenceTemperature),
    max_temperature: text(values.maxTemperature),
    bsat_25: text(values.bsat25 / scale.flux),
    bsat_100: text(values.bsat100 / scale.flux),
    mu_i: text(values.permeability),
    rolloff_a: text(values.rollOffA),
    rolloff_b: text(values.rollOffB),
    rolloff_c: text(values.rollOffC),
    density: text(values.density),
    provenance: values.provenance,
  };
}
