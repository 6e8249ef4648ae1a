// A material version's stored values (SI units: W/m³, Hz, T, kg/m³, °C) and their conversion from and to
// the cells of a CSV row in the row's own unit set.
import type { MaterialFamily } from '@shared/engine/types';
import type { CellProblem } from './csv-import';
import { cellProblems } from './csv-cells';
import {
  kToSi,
  MATERIAL_READ_COLUMNS,
  materialCsvRowSchema,
  oldConversions,
  UNIT_SCALES,
  type MaterialCsvColumn,
  type MaterialCsvRow,
  type MaterialUnitSet,
} from './material-csv';
import { materialWarnings } from './material-warnings';

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
  /** Temperature behaviour F0 + c·(T − T0)² of the loss (all three or none): T0 (°C), F0 (> 0), c (1/K², ≥ 0). */
  lowestLossTemperature: number | null;
  lowestLossFactor: number | null;
  lossCurvature: number | null;
  /** °C at which k holds (the engine divides the factor by its value there); null: k·factor(T) as stored. */
  referenceTemperature: number | null;
  /** Highest tolerated hot-spot temperature (°C); null: the engine's default for the family. */
  maxTemperature: number | null;
  bsat25: number;
  bsat100: number;
  permeability: number;
  /** Powder roll-off μ/μi = 1/(1 + (H/H½)ⁿ) (both or none): H½ (A/m), n. */
  rollOffHalfField: number | null;
  rollOffSteepness: number | null;
  /** Core loss under DC bias: factor 1 + (H/H₂)^m on the zero-bias loss (both or none): H₂ (A/m), m. */
  biasLossDoublingField: number | null;
  biasLossSteepness: number | null;
  density: number;
  provenance: string;
}

/** A checked row as stored, with a notice per old column form it was converted from. */
export function materialValuesFromRow(row: MaterialCsvRow): { values: MaterialValues; notices: CellProblem[] } {
  const scale = UNIT_SCALES[row.unit_set];
  const notices: CellProblem[] = [];
  const { temperature, rollOff } = oldConversions((column) => {
    const value = row[column];
    return typeof value === 'number' ? value : undefined;
  });
  let behaviour =
    row.lowest_loss_temperature !== undefined && row.lowest_loss_factor !== undefined && row.loss_curvature !== undefined
      ? { t0: row.lowest_loss_temperature, f0: row.lowest_loss_factor, c: row.loss_curvature }
      : undefined;
  if (temperature && 'value' in temperature) {
    const b = temperature.value;
    behaviour = { t0: b.lowestLossTemperature, f0: b.lowestLossFactor, c: b.curvature };
    notices.push({ column: 'ct0', message: temperature.notice });
  }
  let curve =
    row.rolloff_half_field !== undefined && row.rolloff_steepness !== undefined
      ? { h: row.rolloff_half_field, n: row.rolloff_steepness }
      : undefined;
  let permeability = row.mu_i;
  if (rollOff && 'value' in rollOff) {
    curve = { h: rollOff.value.rollOff.halfField, n: rollOff.value.rollOff.steepness };
    permeability *= rollOff.value.permeabilityScale;
    notices.push({ column: 'rolloff_a', message: rollOff.notice });
  }
  const values: MaterialValues = {
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
    lowestLossTemperature: behaviour?.t0 ?? null,
    lowestLossFactor: behaviour?.f0 ?? null,
    lossCurvature: behaviour?.c ?? null,
    referenceTemperature: row.t_ref ?? null,
    maxTemperature: row.max_temperature ?? null,
    bsat25: row.bsat_25 * scale.flux,
    bsat100: row.bsat_100 * scale.flux,
    permeability,
    rollOffHalfField: curve?.h ?? null,
    rollOffSteepness: curve?.n ?? null,
    biasLossDoublingField: row.bias_loss_doubling_field ?? null,
    biasLossSteepness: row.bias_loss_steepness ?? null,
    density: row.density,
    provenance: row.provenance,
  };
  return { values, notices };
}

/**
 * Validate one row of cells (column → text); absent columns count as empty cells. Every problem of the row comes
 * at once; `notices` are what does not stop the import (old columns converted, values worth a second look).
 */
export function validateMaterialCells(cells: Partial<Record<string, string>>): {
  values?: MaterialValues;
  problems: CellProblem[];
  notices: CellProblem[];
} {
  const input: Record<string, string> = {};
  for (const column of MATERIAL_READ_COLUMNS) input[column] = cells[column] ?? '';
  const warnings = materialWarnings(input);
  const result = materialCsvRowSchema.safeParse(input);
  if (!result.success) return { problems: cellProblems(result.error.issues), notices: warnings };
  const { values, notices } = materialValuesFromRow(result.data);
  return { values, problems: [], notices: [...notices, ...warnings] };
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
    lowest_loss_temperature: text(values.lowestLossTemperature),
    lowest_loss_factor: text(values.lowestLossFactor),
    loss_curvature: text(values.lossCurvature),
    t_ref: text(values.referenceTemperature),
    max_temperature: text(values.maxTemperature),
    bsat_25: text(values.bsat25 / scale.flux),
    bsat_100: text(values.bsat100 / scale.flux),
    mu_i: text(values.permeability),
    rolloff_half_field: text(values.rollOffHalfField),
    rolloff_steepness: text(values.rollOffSteepness),
    bias_loss_doubling_field: text(values.biasLossDoublingField),
    bias_loss_steepness: text(values.biasLossSteepness),
    density: text(values.density),
    provenance: values.provenance,
  };
}
