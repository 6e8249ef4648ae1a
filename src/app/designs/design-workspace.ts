import { ChangeDetectionStrategy, Component, computed, effect, inject, input, signal, untracked, viewChild } from '@angular/core';
import { takeUntilDestroyed, toSignal } from '@angular/core/rxjs-interop';
import { FormControl, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { Router, RouterLink } from '@angular/router';
import { may } from '@shared/api/permissions';
import type { SearchCandidate } from '@shared/engine/index';
import { gapInputOf } from '@shared/engine/types';
import {
  EXPORT_KINDS,
  wireRequestOf,
  type Construction,
  type DesignDetail,
  type DesignSpec,
  type ExportKind,
} from '@shared/schemas/designs';
import type { EvaluateAnswer } from '@shared/schemas/calc-answers';
import { distinctUntilChanged, map, startWith } from 'rxjs';

import { apiErrorOf, errorMessageOf } from '../core/api-error';
import { Notifier } from '../core/notifier';
import { Session } from '../core/session';
import { LoadState } from '../ui/load-state';
import { CandidatesPanel } from './candidates-panel';
import { DesignPanel } from './design-panel';
import { DesignsApi, type MaterialView } from './designs-api';
import { OperatingPointPanel } from './operating-point-panel';
import { RevisionActions } from '../review/revision-actions';
import { ChecksPanel } from '../checks/checks-panel';
import { DesignOrders } from './design-orders';
import { RevisionsPanel } from './revisions-panel';
import { SpecFormComponent } from './spec-form';
import { createSpecForm, formFromSpec, specFromForm } from './spec-model';

const EXPORT_LABELS: Record<ExportKind, string> = {
  'design.json': 'Design file (JSON)',
  'candidates.csv': 'Candidates (CSV)',
  'bom.csv': 'Bill of materials (CSV)',
  'spice.lib': 'SPICE subcircuit',
};

/** Spec → candidates → design, saved as drafts and revisions. Route: /designs/new or /designs/:id. */
@Component({
  selector: 'gw-design-workspace',
  imports: [
    RevisionActions,
    ReactiveFormsModule,
    RouterLink,
    MatButtonModule,
    MatFormFieldModule,
    MatInputModule,
    LoadState,
    SpecFormComponent,
    OperatingPointPanel,
    CandidatesPanel,
    DesignPanel,
    RevisionsPanel,
    ChecksPanel,
    DesignOrders,
  ],
  templateUrl: './design-workspace.html',
  styleUrl: './design-workspace.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DesignWorkspace {
  private readonly api = inject(DesignsApi);
  private readonly router = inject(Router);
  private readonly notifier = inject(Notifier);
  private readonly session = inject(Session);
  private readonly designPanel = viewChild(DesignPanel);

  /** Route parameter (component input binding); absent for a new design. */
  readonly id = input<string | undefined>(undefined);

  protected readonly specForm = createSpecForm();
  protected readonly title = new FormControl('', { nonNullable: true, validators: [Validators.required, Validators.maxLength(120)] });
  protected readonly materials = toSignal(this.api.materials(), { initialValue: [] as MaterialView[] });
  protected readonly detail = signal<DesignDetail | null>(null);
  protected readonly loading = signal(false);
  protected readonly saving = signal(false);
  protected readonly saveError = signal<string | null>(null);
  protected readonly construction = signal<Construction | null>(null);
  protected readonly known = signal<EvaluateAnswer | null>(null);
  private readonly current = signal<{ construction: Construction; view: EvaluateAnswer } | null>(null);
  protected readonly exportKinds = EXPORT_KINDS;
  protected readonly exportLabels = EXPORT_LABELS;

  protected readonly spec = toSignal(
    this.specForm.valueChanges.pipe(
      startWith(null),
      // A field out of its range (said at the field, in its units) sends nothing: no server message in SI and internal names.
      map(() => (this.specForm.valid ? specFromForm(this.specForm.getRawValue()) : null)),
      distinctUntilChanged((a, b) => JSON.stringify(a) === JSON.stringify(b)),
    ),
    { initialValue: null as DesignSpec | null },
  );

  private readonly isDesigner = computed(() => may(this.session.role(), 'design'));
  /** Build orders and their units are shown to those who may read them. */
  protected readonly canReadOrders = computed(() => may(this.session.role(), 'shop'));
  protected readonly latest = computed(() => this.detail()?.latest ?? null);
  protected readonly editable = computed(() => {
    const d = this.detail();
    if (!d) return this.isDesigner();
    return d.latest.canEdit;
  });
  protected readonly canStartRevision = computed(() => this.detail()?.canRevise ?? false);

  constructor() {
    effect(() => {
      const id = this.id();
      untracked(() => (id ? this.load(Number(id)) : this.reset()));
    });
    effect(() => {
      const editable = this.editable();
      untracked(() => {
        if (editable) {
          this.specForm.enable({ emitEvent: false });
          this.title.enable({ emitEvent: false });
        } else {
          this.specForm.disable({ emitEvent: false });
          this.title.disable({ emitEvent: false });
        }
      });
    });
    // A new spec re-evaluates the chosen construction.
    this.specForm.valueChanges.pipe(takeUntilDestroyed()).subscribe(() => {
      if (this.construction()) this.designPanel()?.reevaluate();
    });
  }

  private reset(): void {
    this.detail.set(null);
    this.title.setValue('');
    this.construction.set(null);
    this.known.set(null);
    this.current.set(null);
  }

  /** After a review step (submit, approve, return, release) the status and timeline change. */
  protected reloadDesign(): void {
    const d = this.detail();
    if (d) this.load(d.id);
  }

  private load(id: number): void {
    this.loading.set(true);
    this.api.get(id).subscribe({
      next: (detail) => {
        this.loading.set(false);
        this.show(detail);
      },
      error: () => this.loading.set(false),
    });
  }

  private show(detail: DesignDetail): void {
    this.detail.set(detail);
    this.title.setValue(detail.title);
    this.specForm.patchValue(formFromSpec(detail.latest.spec));
    const saved = detail.latest.result;
    const stored = saved ? { engineVersion: detail.latest.engineVersion ?? '', wire: saved.wire, result: saved.evaluation } : null;
    const construction = detail.latest.construction;
    this.known.set(stored);
    this.construction.set(construction);
    this.current.set(construction && stored ? { construction, view: this.known()! } : null);
  }

  protected pick(candidate: SearchCandidate): void {
    const r = candidate.result;
    const construction: Construction = {
      coreId: r.core.id,
      materialId: r.material.id,
      turns: r.turns,
      gap: gapInputOf(r.gap),
      placement: candidate.placement,
      // The search may have moved the copper further from the gap than the limits' keep-out.
      keepOut: r.winding.keepOut,
      wire: wireRequestOf(candidate.wire),
    };
    const view: EvaluateAnswer = { engineVersion: '', wire: candidate.wire, result: r };
    this.known.set(view);
    this.construction.set(construction);
    this.current.set({ construction, view });
    if (!this.title.value) this.title.setValue(`${r.core.id} in ${r.material.name}`.slice(0, 120));
    queueMicrotask(() => document.getElementById('gw-design-title')?.scrollIntoView({ behavior: 'smooth', block: 'start' }));
  }

  protected edited(change: { construction: Construction; view: EvaluateAnswer }): void {
    this.current.set(change);
  }

  protected save(): void {
    const spec = this.spec();
    this.title.markAsTouched();
    if (!spec || this.title.invalid) {
      this.specForm.markAllAsTouched();
      this.saveError.set(!spec ? 'Complete the spec before saving.' : 'Give the design a title.');
      return;
    }
    const construction = this.current()?.construction ?? null;
    const detail = this.detail();
    this.saving.set(true);
    this.saveError.set(null);
    const done = {
      error: (error: unknown) => {
        this.saving.set(false);
        this.showErrors(error);
      },
    };
    if (!detail) {
      this.api.create(this.title.value, spec, construction).subscribe({
        ...done,
        next: (created) => {
          this.saving.set(false);
          this.notifier.info(`Design ${created.number} saved as a draft.`);
          void this.router.navigate(['/designs', created.id], { replaceUrl: true });
        },
      });
      return;
    }
    this.api.update(detail.id, detail.latest.revision, { title: this.title.value, spec, construction }).subscribe({
      ...done,
      next: () => {
        this.saving.set(false);
        this.notifier.info(`Revision ${detail.latest.revision} of ${detail.number} saved.`);
        this.load(detail.id);
      },
    });
  }

  protected startRevision(): void {
    const detail = this.detail();
    if (!detail) return;
    this.api.newRevision(detail.id).subscribe(() => {
      this.notifier.info(`Revision ${detail.latest.revision + 1} started as a draft.`);
      this.load(detail.id);
    });
  }

  protected copy(): void {
    const detail = this.detail();
    if (!detail) return;
    this.api.copy(detail.id).subscribe((created) => {
      this.notifier.info(`Copied to ${created.number}.`);
      void this.router.navigate(['/designs', created.id]);
    });
  }

  protected exportUrl(kind: ExportKind): string {
    const d = this.detail();
    return d ? this.api.exportUrl(d.id, d.latest.revision, kind) : '';
  }

  /** The server's messages go under the matching spec fields ("spec.converter.vout" → Vout). */
  private showErrors(error: unknown): void {
    const fields = apiErrorOf(error)?.fields ?? {};
    let placed = false;
    for (const [path, message] of Object.entries(fields)) {
      const name = path.split('.').at(-1)!;
      const control = path === 'title' ? this.title : (this.specForm.get(name) ?? null);
      if (!control) continue;
      control.setErrors({ server: message });
      control.markAsTouched();
      placed = true;
    }
    this.saveError.set(placed ? 'Some fields need attention.' : errorMessageOf(error));
  }
}
