import { DecimalPipe } from '@angular/common';
import {
  ChangeDetectionStrategy,
  Component,
  ElementRef,
  computed,
  effect,
  inject,
  input,
  output,
  signal,
  untracked,
  viewChild,
} from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import type { GapPlacement } from '@shared/engine/types';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { MatSort, MatSortModule } from '@angular/material/sort';
import { MatTableDataSource, MatTableModule } from '@angular/material/table';
import { RouterLink } from '@angular/router';
import type { CompareDesignResponse, DesignComparisonRow, DesignFluxPoint } from '@shared/schemas/compare';
import type { RevisionSummary } from '@shared/schemas/designs';
import type { QuantityKind } from '@shared/units/index';
import { map, of, switchMap, catchError, type Observable } from 'rxjs';

import { CautionLine } from '../caution-line/caution-line';
import { showServerFieldErrors } from '../core/server-field-errors';
import { DesignsApi } from '../designs/designs-api';
import { QuantityPipe } from '../units/quantity';
import { QuantityInput } from '../units/quantity-input';
import { LoadState } from '../ui/load-state';
import { CompareApi } from './compare-api';

export type DesignSource = 'saved' | 'typed';

/** The converter of a typed-in design: quantity fields, limits in SI. */
const QUANTITY_FIELDS: readonly {
  name: 'vinMin' | 'vinMax' | 'vout' | 'ioutMax' | 'frequency' | 'rippleRatio';
  label: string;
  kind: QuantityKind;
  min: number;
  max?: number;
}[] = [
  { name: 'vinMin', label: 'Vin min', kind: 'voltage', min: 0.5 },
  { name: 'vinMax', label: 'Vin max', kind: 'voltage', min: 0.5 },
  { name: 'vout', label: 'Vout', kind: 'voltage', min: 0.1 },
  { name: 'ioutMax', label: 'Iout', kind: 'current', min: 0.001 },
  { name: 'frequency', label: 'Switching frequency', kind: 'frequency', min: 1e3, max: 10e6 },
  { name: 'rippleRatio', label: 'Ripple ratio ΔI/Iout', kind: 'ratio', min: 0.01, max: 2 },
];

/** One design's losses with every material: a saved revision, or a design typed in here. */
@Component({
  selector: 'gw-design-comparison',
  imports: [
    CautionLine,
    DecimalPipe,
    MatButtonModule,
    MatButtonToggleModule,
    MatFormFieldModule,
    MatInputModule,
    LoadState,
    MatSelectModule,
    MatSortModule,
    MatTableModule,
    QuantityInput,
    QuantityPipe,
    ReactiveFormsModule,
    RouterLink,
  ],
  templateUrl: './design-comparison.html',
  styleUrl: './design-comparison.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DesignComparison {
  private readonly api = inject(CompareApi);
  private readonly designsApi = inject(DesignsApi);
  private readonly sort = viewChild(MatSort);
  private readonly resultHeading = viewChild<ElementRef<HTMLElement>>('resultHeading');
  /** Opened from a design page: bring the answer into view once it arrives, it sits below the curves. */
  private readonly revealResult = signal(false);

  /** A saved revision to compare at once (from the page's query parameters). */
  readonly designId = input<string | undefined>();
  readonly revision = input<string | undefined>();
  /** Asks the page to draw the loss curves where this design's core works. */
  readonly drawAt = output<DesignFluxPoint>();

  protected readonly source = signal<DesignSource>('saved');
  protected readonly cores = this.api.coresResource();
  protected readonly designs = toSignal(
    this.designsApi.list({ scope: 'all', q: '', sort: 'updated', dir: 'desc', page: 0, pageSize: 100 }).pipe(map((r) => r.items)),
    { initialValue: [] },
  );

  protected readonly savedForm = new FormGroup({
    designId: new FormControl<number | null>(null, { validators: [Validators.required] }),
    revision: new FormControl<number | null>(null, { validators: [Validators.required] }),
  });
  protected readonly chosenDesign = toSignal(this.savedForm.controls.designId.valueChanges, { initialValue: null });
  protected readonly revisions = toSignal(this.savedForm.controls.designId.valueChanges.pipe(switchMap((id) => this.revisionsOf(id))), {
    initialValue: [] as RevisionSummary[],
  });

  protected readonly typedForm = new FormGroup({
    // Quantities in SI, typed with units ("36 V", "100 kHz", "30 %"); limits are the fields' own (QUANTITY_FIELDS).
    vinMin: new FormControl<number | null>(24),
    vinMax: new FormControl<number | null>(36),
    vout: new FormControl<number | null>(12),
    ioutMax: new FormControl<number | null>(10),
    frequency: new FormControl<number | null>(100e3),
    rippleRatio: new FormControl<number | null>(0.3),
    coreId: new FormControl('ETD34/17/11', { nonNullable: true, validators: [Validators.required] }),
    turns: new FormControl(20, { nonNullable: true, validators: [Validators.required, Validators.min(1), Validators.max(2000)] }),
    awg: new FormControl(18, { nonNullable: true, validators: [Validators.required, Validators.min(-3), Validators.max(46)] }),
    strands: new FormControl(2, { nonNullable: true, validators: [Validators.required, Validators.min(1), Validators.max(5000)] }),
    placement: new FormControl<GapPlacement>('ground', { nonNullable: true }),
  });
  protected readonly quantityFields = QUANTITY_FIELDS;
  protected readonly typedFields = [
    { name: 'turns', label: 'Turns' },
    { name: 'awg', label: 'Wire (AWG)' },
    { name: 'strands', label: 'Wires in hand' },
  ] as const;

  /** The figures of each row, in W or K with the digits they are shown to. */
  protected readonly figureColumns: readonly { name: keyof DesignComparisonRow; header: string; digits: string }[] = [
    { name: 'coreLoss', header: 'Core loss (W)', digits: '1.3-3' },
    { name: 'copperLoss', header: 'Copper loss (W)', digits: '1.3-3' },
    { name: 'totalLoss', header: 'Total loss (W)', digits: '1.3-3' },
    { name: 'temperatureRise', header: 'Rise (K)', digits: '1.0-1' },
  ];
  protected readonly columns = ['name', 'status', 'gap', ...this.figureColumns.map((c) => c.name), 'notes'];
  protected readonly rows = new MatTableDataSource<DesignComparisonRow>([]);
  protected readonly loading = signal(false);
  protected readonly error = signal<string | null>(null);
  protected readonly result = signal<CompareDesignResponse | null>(null);
  protected readonly heading = computed(() => {
    const r = this.result();
    if (!r) return '';
    const what = r.design ? `${r.design.number} revision ${r.design.revision} · ${r.design.title}` : 'The design typed in';
    return `${what}: ${r.coreId}, ${r.turns} turns, ${r.placement === 'spacer' ? 'spacer under all legs' : 'ground centre gap'}`;
  });
  protected readonly chosenDesignNumber = computed(() => this.designs().find((d) => d.id === this.chosenDesign())?.number ?? '');

  constructor() {
    effect(() => {
      const sort = this.sort();
      if (sort) this.rows.sort = sort;
    });
    // Rows that could not be computed sort last whatever the direction.
    this.rows.sortingDataAccessor = (row, column) => {
      const value = (row as unknown as Record<string, unknown>)[column];
      return typeof value === 'number' || typeof value === 'string' ? value : Number.MAX_VALUE;
    };
    effect(() => {
      const heading = this.resultHeading();
      if (heading && untracked(this.revealResult)) {
        this.revealResult.set(false);
        heading.nativeElement.scrollIntoView?.({ block: 'start' });
      }
    });
    effect(() => {
      const id = Number(this.designId());
      const revision = Number(this.revision());
      if (!Number.isInteger(id) || id < 1 || !Number.isInteger(revision) || revision < 1) return;
      untracked(() => {
        this.source.set('saved');
        this.savedForm.setValue({ designId: id, revision });
        this.revealResult.set(true);
        this.compareSaved();
      });
    });
  }

  /** Revisions of a design, newest first; a failed load leaves the list empty (the design list said it exists). */
  private revisionsOf(id: number | null): Observable<RevisionSummary[]> {
    if (!id) return of([]);
    return this.designsApi.get(id).pipe(
      map((d) => [...d.revisions].sort((a, b) => b.revision - a.revision)),
      catchError(() => of([])),
    );
  }

  protected onDesignChosen(): void {
    // The newest revision with a construction is the usual question; the engineer may pick another.
    const latest = this.designs().find((d) => d.id === this.savedForm.controls.designId.value)?.revision ?? null;
    this.savedForm.controls.revision.setValue(latest);
  }

  protected compareSaved(): void {
    const { designId, revision } = this.savedForm.getRawValue();
    if (this.savedForm.invalid || designId === null || revision === null) {
      this.savedForm.markAllAsTouched();
      return;
    }
    this.run(this.api.savedDesign(designId, revision), this.savedForm);
  }

  protected compareTyped(): void {
    if (this.typedForm.invalid) {
      this.typedForm.markAllAsTouched();
      return;
    }
    const v = this.typedForm.getRawValue();
    this.run(
      this.api.design({
        spec: {
          vinMin: v.vinMin!,
          vinMax: v.vinMax!,
          vout: v.vout!,
          ioutMax: v.ioutMax!,
          frequency: v.frequency!,
          rippleRatio: v.rippleRatio!,
        },
        coreId: v.coreId,
        turns: v.turns,
        wire: { kind: 'awg', awg: v.awg, strands: v.strands },
        placement: v.placement,
      }),
      this.typedForm,
    );
  }

  private run(request: Observable<CompareDesignResponse>, form: FormGroup): void {
    this.loading.set(true);
    this.error.set(null);
    request.subscribe({
      next: (result) => {
        this.loading.set(false);
        this.result.set(result);
        this.rows.data = result.rows;
      },
      error: (error: unknown) => {
        this.loading.set(false);
        this.error.set(showServerFieldErrors(form, error) ?? 'Some fields need attention; see the messages under them.');
      },
    });
  }
}
