import { ChangeDetectionStrategy, Component, computed, effect, inject, input, linkedSignal, signal, untracked } from '@angular/core';
import { DatePipe } from '@angular/common';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatSelectModule } from '@angular/material/select';
import type { DesignDetail, RevisionDiff } from '@shared/schemas/designs';

import { errorMessageOf } from '../core/api-error';
import { DesignsApi } from './designs-api';
import { figureLabel, figureValue } from './diff-labels';
import { STATUS_LABELS, show } from './format';

/** Revision history and a side-by-side diff of spec, construction and results between two revisions. */
@Component({
  selector: 'gw-revisions-panel',
  imports: [DatePipe, MatButtonModule, MatFormFieldModule, MatSelectModule],
  template: `
    <section aria-labelledby="gw-revisions-title">
      <h2 id="gw-revisions-title">Revisions</h2>
      <div class="gw-table-scroll" role="region" aria-label="Revision history, scrollable" tabindex="0">
        <table class="gw-plain">
          <caption class="gw-visually-hidden">
            Revision history
          </caption>
          <thead>
            <tr>
              <th scope="col">Revision</th>
              <th scope="col">Status</th>
              <th scope="col">Total loss</th>
              <th scope="col">Engine</th>
              <th scope="col">Updated</th>
              <th scope="col">Note</th>
            </tr>
          </thead>
          <tbody>
            @for (r of design().revisions; track r.revision) {
              <tr>
                <td>{{ r.revision }}</td>
                <td>{{ statusLabel(r.status) }}</td>
                <td>{{ fmt(r.totalLoss, 'power') }}</td>
                <td>{{ r.engineVersion ?? '—' }}</td>
                <td>{{ r.updatedAt | date: 'medium' }}</td>
                <td>{{ r.note ?? '' }}</td>
              </tr>
            }
          </tbody>
        </table>
      </div>
      @if (design().revisions.length > 1) {
        <div class="gw-diff-controls">
          @for (end of ends; track end.label) {
            <mat-form-field subscriptSizing="dynamic">
              <mat-label>{{ end.label }}</mat-label>
              <mat-select [value]="end.revision()" (selectionChange)="end.revision.set($event.value)">
                @for (r of design().revisions; track r.revision) {
                  <mat-option [value]="r.revision">{{ r.revision }}</mat-option>
                }
              </mat-select>
            </mat-form-field>
          }
          <button mat-stroked-button type="button" (click)="compare()">Compare</button>
        </div>
      }
      @if (error()) {
        <p class="gw-form-error" role="alert">{{ error() }}</p>
      }
      @if (diff(); as d) {
        @for (section of sections(d); track section.title) {
          <h3>{{ section.title }}</h3>
          @if (section.rows.length) {
            <div class="gw-table-scroll" role="region" [attr.aria-label]="section.title + ' differences, scrollable'" tabindex="0">
              <table class="gw-plain gw-diff">
                <caption class="gw-visually-hidden">
                  {{
                    section.title
                  }}: revision
                  {{
                    d.from
                  }}
                  against
                  {{
                    d.to
                  }}
                </caption>
                <thead>
                  <tr>
                    <th scope="col">Figure</th>
                    <th scope="col">Revision {{ d.from }}</th>
                    <th scope="col">Revision {{ d.to }}</th>
                  </tr>
                </thead>
                <tbody>
                  @for (row of section.rows; track row.path) {
                    <tr>
                      <th scope="row" [attr.title]="row.path">{{ label(row.path) }}</th>
                      <td>{{ value(row.path, row.from) }}</td>
                      <td>{{ value(row.path, row.to) }}</td>
                    </tr>
                  }
                </tbody>
              </table>
            </div>
          } @else {
            <p>No differences.</p>
          }
        }
      }
    </section>
  `,
  styles: `
    .gw-plain {
      border-collapse: collapse;
      width: 100%;
    }
    .gw-plain th,
    .gw-plain td {
      text-align: left;
      padding: 4px 8px;
      border-bottom: 1px solid var(--mat-sys-outline-variant);
      font-variant-numeric: tabular-nums;
    }
    .gw-diff-controls {
      display: flex;
      flex-wrap: wrap;
      gap: 8px 16px;
      align-items: center;
      margin: 12px 0;
    }
    .gw-diff {
      max-height: 360px;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RevisionsPanel {
  private readonly api = inject(DesignsApi);
  readonly design = input.required<DesignDetail>();
  protected readonly latest = computed(() => this.design().revisions.at(-1)?.revision ?? 1);
  /** The two latest revisions until the user picks others (a new revision resets them). */
  protected readonly to = linkedSignal(() => this.latest());
  protected readonly from = linkedSignal(() => Math.max(1, this.latest() - 1));
  protected readonly ends = [
    { label: 'From revision', revision: this.from },
    { label: 'To revision', revision: this.to },
  ];
  protected readonly diff = signal<RevisionDiff | null>(null);
  protected readonly error = signal<string | null>(null);
  protected readonly fmt = show;
  protected readonly label = figureLabel;
  protected readonly value = figureValue;

  constructor() {
    // The two latest revisions are compared as soon as a design has two.
    effect(() => {
      if (this.latest() > 1) untracked(() => this.compare());
    });
  }

  protected statusLabel(status: string): string {
    return STATUS_LABELS[status] ?? status;
  }

  protected compare(): void {
    this.api.diff(this.design().id, this.from(), this.to()).subscribe({
      next: (d) => {
        this.error.set(null);
        this.diff.set(d);
      },
      error: (e: unknown) => this.error.set(errorMessageOf(e)),
    });
  }

  protected sections(d: RevisionDiff) {
    return [
      { title: 'Spec', rows: d.spec },
      { title: 'Construction', rows: d.construction },
      { title: 'Results', rows: d.result },
    ];
  }
}
