// What a material row may hold but deserves a second look: shown beside the row in the upload preview and under
// the edit form, never stopping the import.
import type { CellProblem } from './csv-import';
import { optionalNumberCell } from './csv-cells';

const numberCell = optionalNumberCell({});

/** A cell's number, or undefined when empty or not a number (its own check reports that). */
function numberOf(text: string | undefined): number | undefined {
  const parsed = numberCell.safeParse(text ?? '');
  return parsed.success ? parsed.data : undefined;
}

/** Warnings of one row of cells (column → text); both flux cells are in the row's own unit set, so they compare as given. */
export function materialWarnings(cells: Partial<Record<string, string>>): CellProblem[] {
  const warnings: CellProblem[] = [];
  const [bsat25, bsat100] = [numberOf(cells['bsat_25']), numberOf(cells['bsat_100'])];
  // Ferrite saturation falls as it warms towards its Curie temperature (common practice, no source).
  if (bsat25 !== undefined && bsat100 !== undefined && bsat100 > bsat25) {
    warnings.push({
      column: 'bsat_100',
      message: 'exceeds bsat_25: ferrite saturation normally falls with temperature; check the columns are not swapped',
    });
  }
  return warnings;
}
