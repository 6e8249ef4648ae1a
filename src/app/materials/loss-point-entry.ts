import { ChangeDetectionStrategy, Component, effect, inject, input, output, signal } from '@angular/core';
import { FormArray, NonNullableFormBuilder, ReactiveFormsModule, type FormControl, type FormGroup } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import type { LossPoint } from '@shared/fitting/loss-points';
import { LOSS_POINT_CSV_COLUMNS, type LossPointCsvColumn } from '@shared/schemas/loss-point-csv';

import { cellsFromPastedText, cellsOfPoint, emptyLossPointCells, lossPointFileOf, type LossPointCells } from './loss-point-rows';

type RowForm = FormGroup<Record<LossPointCsvColumn, FormControl<string>>>;

/** Most rows the editable table holds; more points go in a file (an input per cell grows slow beyond this). */
export const MAX_TYPED_POINTS = 500;

/** Column headings of the editable table, in the CSV's units. */
export const ENTRY_HEADINGS: Record<LossPointCsvColumn, string> = {
  frequency_khz: 'Frequency (kHz)',
  peak_flux_mt: 'Peak flux B̂ (mT)',
  temperature_c: 'Temperature (°C)',
  loss_kw_per_m3: 'Loss density (kW/m³)',
  dc_bias_a_per_m: 'DC bias (A/m)',
  source: 'Source',
};

/**
 * Points typed or pasted into an editable table, starting from the version's own points. "Check these points" hands
 * them on as a loss-point CSV file, so the server checks them by row and column exactly as it checks an upload.
 */
@Component({
  selector: 'gw-loss-point-entry',
  imports: [ReactiveFormsModule, MatButtonModule, MatIconModule],
  templateUrl: './loss-point-entry.html',
  styleUrl: './loss-point-entry.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class LossPointEntry {
  private readonly fb = inject(NonNullableFormBuilder);
  readonly points = input<readonly LossPoint[]>([]);
  readonly disabled = input(false);
  readonly entered = output<File>();

  protected readonly columns = LOSS_POINT_CSV_COLUMNS;
  protected readonly headings = ENTRY_HEADINGS;
  protected readonly maxRows = MAX_TYPED_POINTS;
  protected readonly rows = new FormArray<RowForm>([]);
  protected readonly pasted = this.fb.control('');
  protected readonly note = signal<string | null>(null);

  constructor() {
    effect(() => this.replaceRows(this.points().slice(0, MAX_TYPED_POINTS).map(cellsOfPoint)));
  }

  protected addRow(): void {
    if (this.rows.length < MAX_TYPED_POINTS) this.rows.push(this.rowForm(emptyLossPointCells()));
  }

  protected removeRow(index: number): void {
    this.rows.removeAt(index);
  }

  /** Pasted rows are added below the table's own (a header line in the paste decides the column order). */
  protected addPasted(): void {
    let cells: LossPointCells[];
    try {
      cells = cellsFromPastedText(this.pasted.value);
    } catch (error) {
      this.note.set(`The pasted text could not be read: ${error instanceof Error ? error.message : String(error)}`);
      return;
    }
    const room = MAX_TYPED_POINTS - this.rows.length;
    cells.slice(0, room).forEach((row) => this.rows.push(this.rowForm(row)));
    this.note.set(
      cells.length > room
        ? `Added ${room} of ${cells.length} pasted rows; the table holds ${MAX_TYPED_POINTS}. Upload a file for more.`
        : `Added ${cells.length} pasted ${cells.length === 1 ? 'row' : 'rows'}.`,
    );
    this.pasted.setValue('');
  }

  protected clear(): void {
    this.replaceRows([]);
    this.note.set(null);
  }

  protected check(): void {
    this.entered.emit(lossPointFileOf(this.rows.getRawValue()));
  }

  private replaceRows(cells: readonly LossPointCells[]): void {
    this.rows.clear();
    cells.forEach((row) => this.rows.push(this.rowForm(row)));
  }

  private rowForm(cells: LossPointCells): RowForm {
    return this.fb.group(
      Object.fromEntries(LOSS_POINT_CSV_COLUMNS.map((c) => [c, this.fb.control(cells[c])])) as Record<
        LossPointCsvColumn,
        FormControl<string>
      >,
    );
  }
}
