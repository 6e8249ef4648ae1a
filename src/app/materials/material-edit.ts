import { ChangeDetectionStrategy, Component, ElementRef, Injector, afterNextRender, computed, inject, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { FormControl, FormGroup, ReactiveFormsModule, Validators, type AbstractControl, type ValidationErrors } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { MATERIAL_FAMILIES } from '@shared/engine/types';
import { NUMBER_TEXT } from '@shared/schemas/csv-cells';
import {
  kFromSi,
  kToSi,
  MATERIAL_CSV_COLUMNS,
  MATERIAL_UNIT_SETS,
  REQUIRED_MATERIAL_COLUMNS,
  UNIT_SCALES,
  type MaterialCsvColumn,
  type MaterialUnitSet,
} from '@shared/schemas/material-csv';
import type { MaterialEdit as MaterialEditCells } from '@shared/schemas/material-requests';
import { materialWarnings } from '@shared/schemas/material-warnings';
import { map } from 'rxjs';

import { errorMessageOf } from '../core/api-error';
import { showServerFieldErrors } from '../core/server-field-errors';
import { MaterialsApi, type LibraryMaterial } from './materials-api';

type Cells = Record<MaterialCsvColumn, string>;

const TEXT_COLUMNS: readonly MaterialCsvColumn[] = ['name', 'family', 'unit_set', 'provenance'];
const FREQUENCY_COLUMNS: readonly MaterialCsvColumn[] = ['f_min', 'f_max'];
const FLUX_COLUMNS: readonly MaterialCsvColumn[] = ['b_min', 'b_max', 'bsat_25', 'bsat_100'];
/** The cells a change of unit set rewrites. */
const CONVERTED_COLUMNS: readonly MaterialCsvColumn[] = ['k', ...FREQUENCY_COLUMNS, ...FLUX_COLUMNS];

const LOSS_UNITS: Record<MaterialUnitSet, string> = { 'W/m3-Hz-T': 'W/m³', 'mW/cm3-kHz-mT': 'mW/cm³' };
const UNIT_SET_LABELS: Record<MaterialUnitSet, string> = {
  'W/m3-Hz-T': 'W/m³, Hz, T (SI)',
  'mW/cm3-kHz-mT': 'mW/cm³, kHz, mT',
};

function numberText(control: AbstractControl<string>): ValidationErrors | null {
  const text = control.value.trim();
  return text === '' || NUMBER_TEXT.test(text) ? null : { number: true };
}

function controlsFor(cells: Cells): Record<MaterialCsvColumn, FormControl<string>> {
  const controls = {} as Record<MaterialCsvColumn, FormControl<string>>;
  for (const column of MATERIAL_CSV_COLUMNS) {
    const validators = [
      ...(REQUIRED_MATERIAL_COLUMNS.includes(column) ? [Validators.required] : []),
      ...(TEXT_COLUMNS.includes(column) ? [] : [numberText]),
    ];
    controls[column] = new FormControl(cells[column], { nonNullable: true, validators });
  }
  return controls;
}

/** A number cell times a factor, to 12 significant digits (no binary noise); other text as it is. */
function scaled(text: string, factor: number): string {
  const trimmed = text.trim();
  return NUMBER_TEXT.test(trimmed) ? String(Number((Number(trimmed) * factor).toPrecision(12))) : text;
}

/** k, the fitted range and Bsat of some cells rewritten from their unit set into another (k needs α and β). */
function convertedCells(cells: Cells, to: MaterialUnitSet): Partial<Cells> {
  const from = cells.unit_set as MaterialUnitSet;
  const alpha = Number(cells.alpha.trim());
  const beta = Number(cells.beta.trim());
  const kFactor =
    NUMBER_TEXT.test(cells.alpha.trim()) && NUMBER_TEXT.test(cells.beta.trim()) ? kFromSi(kToSi(1, from, alpha, beta), to, alpha, beta) : 1;
  const out: Partial<Cells> = { k: scaled(cells.k, kFactor) };
  for (const c of FREQUENCY_COLUMNS) out[c] = scaled(cells[c], UNIT_SCALES[from].frequency / UNIT_SCALES[to].frequency);
  for (const c of FLUX_COLUMNS) out[c] = scaled(cells[c], UNIT_SCALES[from].flux / UNIT_SCALES[to].flux);
  return out;
}

interface NumberField {
  column: MaterialCsvColumn;
  label: string;
  hint?: string;
}
interface FieldSection {
  id: string;
  legend: string;
  note?: string;
  fields: NumberField[];
}

/**
 * Edits one material as the cells of its CSV row, in its own unit set. Only changed cells are sent;
 * the server checks them with the import's rules and stores a new version.
 */
@Component({
  selector: 'gw-material-edit',
  imports: [MatButtonModule, MatDialogModule, MatFormFieldModule, MatInputModule, MatSelectModule, ReactiveFormsModule],
  templateUrl: './material-edit.html',
  styleUrl: './material-edit.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class MaterialEdit {
  protected readonly material = inject<LibraryMaterial>(MAT_DIALOG_DATA);
  private readonly dialogRef = inject<MatDialogRef<MaterialEdit, LibraryMaterial>>(MatDialogRef);
  private readonly api = inject(MaterialsApi);
  private readonly host = inject<ElementRef<HTMLElement>>(ElementRef);
  private readonly injector = inject(Injector);

  protected readonly families = MATERIAL_FAMILIES;
  protected readonly unitSets = MATERIAL_UNIT_SETS.map((value) => ({ value, label: UNIT_SET_LABELS[value] }));
  protected readonly form = new FormGroup(controlsFor(this.material.cells));
  protected readonly busy = signal(false);
  protected readonly formError = signal<string | null>(null);
  private readonly unitSet = signal(this.material.cells.unit_set as MaterialUnitSet);
  private readonly cells = toSignal(this.form.valueChanges.pipe(map(() => this.form.getRawValue())), {
    initialValue: this.form.getRawValue(),
  });
  /** What the import would note for these cells (saving is still allowed). */
  protected readonly warnings = computed(() => materialWarnings(this.cells()));

  protected readonly sections = computed((): FieldSection[] => {
    const set = this.unitSet();
    const { frequencyUnit: f, fluxUnit: b } = UNIT_SCALES[set];
    return [
      {
        id: 'steinmetz',
        legend: 'Steinmetz loss Pv = k·f^α·B̂^β',
        note: 'B̂ is the peak flux density, half the peak-to-peak swing.',
        fields: [
          { column: 'k', label: `k (${LOSS_UNITS[set]} with f in ${f}, B̂ in ${b})` },
          { column: 'alpha', label: 'α, frequency exponent (no unit)' },
          { column: 'beta', label: 'β, flux exponent (no unit)' },
        ],
      },
      {
        id: 'fit',
        legend: 'Range the fit holds for',
        fields: [
          { column: 'f_min', label: `Lowest frequency f min (${f})` },
          { column: 'f_max', label: `Highest frequency f max (${f})` },
          { column: 'b_min', label: `Lowest peak flux B̂ min (${b})` },
          { column: 'b_max', label: `Highest peak flux B̂ max (${b})` },
        ],
      },
      {
        id: 'temperature',
        legend: 'How core loss changes with temperature (optional)',
        note: 'The loss is k·f^α·B̂^β times a factor F0 + c·(T − T0)²: lowest at T0, rising on either side. Give all three or none; leave them empty for no temperature correction. With t_ref, k is the loss at t_ref and the factor is divided by its value there.',
        fields: [
          { column: 'lowest_loss_temperature', label: 'Temperature of lowest loss (°C)', hint: 'T0, where the loss curve bottoms out' },
          { column: 'lowest_loss_factor', label: 'Loss factor there', hint: 'F0 > 0; 1 when k holds at T0' },
          { column: 'loss_curvature', label: 'Curvature (1/K²)', hint: 'c ≥ 0; e.g. 1e-4 doubles the loss 100 K from T0' },
          { column: 't_ref', label: 'Reference temperature t_ref (°C)', hint: 'where k was measured' },
        ],
      },
      {
        id: 'limit',
        legend: 'Temperature limit (optional)',
        note: 'The highest hot-spot temperature the material tolerates, 50 to 400 °C. Empty: 200 °C for ferrite, no limit for the other families.',
        fields: [{ column: 'max_temperature', label: 'Highest temperature max_temperature (°C)' }],
      },
      {
        id: 'magnetic',
        legend: 'Saturation, permeability and density',
        fields: [
          { column: 'bsat_25', label: `Bsat at 25 °C (${b})` },
          { column: 'bsat_100', label: `Bsat at 100 °C (${b})` },
          { column: 'mu_i', label: 'Initial permeability μi (relative, no unit)' },
          { column: 'density', label: 'Density (kg/m³)' },
        ],
      },
      {
        id: 'rolloff',
        legend: 'Permeability under DC bias (optional, for powder materials)',
        note: 'μ/μi = 1/(1 + (H/H½)ⁿ), H in A/m. Give both or none; leave them empty for materials whose permeability does not roll off with bias.',
        fields: [
          { column: 'rolloff_half_field', label: 'Field at half permeability H½ (A/m)', hint: 'the bias field where μ has fallen to μi/2' },
          { column: 'rolloff_steepness', label: 'Roll-off steepness n', hint: 'how sharply μ falls around H½; > 0' },
        ],
      },
      {
        id: 'bias-loss',
        legend: 'Core loss under DC bias (optional)',
        note: 'The loss k·f^α·B̂^β rises with the DC field H in the material by the factor 1 + (H/H₂)^m. Give both or none; without them a design says that DC bias is not included in its core loss. Loss points taken under bias can be fitted to these two numbers.',
        fields: [
          {
            column: 'bias_loss_doubling_field',
            label: 'Field at double loss H₂ (A/m)',
            hint: 'the DC field in the material where the loss has doubled',
          },
          { column: 'bias_loss_steepness', label: 'Rise steepness m', hint: 'how sharply the loss rises around H₂; > 0' },
        ],
      },
    ];
  });

  /** Rewrites k, the fitted range and Bsat into the chosen unit set; back in the stored set, untouched cells read as stored. */
  protected changeUnitSet(to: MaterialUnitSet): void {
    const from = this.unitSet();
    if (to === from) return;
    const shown: Cells = { ...this.form.getRawValue(), unit_set: from };
    const next = convertedCells(shown, to);
    const stored = this.material.cells;
    if (to === stored.unit_set) {
      // What the stored cells looked like in the set just left: cells still showing that are restored exactly.
      const storedAsShown = convertedCells({ ...stored, alpha: shown.alpha, beta: shown.beta }, from);
      for (const c of CONVERTED_COLUMNS) if (shown[c] === storedAsShown[c]) next[c] = stored[c];
    }
    this.form.patchValue(next);
    this.unitSet.set(to);
  }

  protected save(): void {
    this.form.markAllAsTouched();
    if (this.form.invalid) return;
    const cells = this.changedCells();
    if (!Object.keys(cells).length) {
      this.formError.set('Nothing has changed, so there is no new version to save.');
      return;
    }
    this.busy.set(true);
    this.formError.set(null);
    this.api.edit(this.material.id, cells).subscribe({
      next: (saved) => this.dialogRef.close(saved),
      error: (error: unknown) => {
        this.busy.set(false);
        showServerFieldErrors(this.form, error);
        this.formError.set(errorMessageOf(error));
        this.focusFirstProblem();
      },
    });
  }

  /** Once the errors are drawn, the first field the server named gets the focus (and scrolls into view). */
  private focusFirstProblem(): void {
    afterNextRender(
      () => {
        const field = this.host.nativeElement.querySelector<HTMLElement>('[aria-invalid="true"]');
        // Centred, so the message under the field is in view too.
        field?.scrollIntoView?.({ block: 'center' });
        field?.focus({ preventScroll: true });
      },
      { injector: this.injector },
    );
  }

  private changedCells(): MaterialEditCells {
    const now = this.form.getRawValue();
    const changed: MaterialEditCells = {};
    for (const column of MATERIAL_CSV_COLUMNS) {
      const text = now[column].trim();
      if (text !== this.material.cells[column]) changed[column] = text;
    }
    return changed;
  }
}
