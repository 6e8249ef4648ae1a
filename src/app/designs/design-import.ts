import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { Router } from '@angular/router';
import { designFileSchema, type DesignFile } from '@shared/schemas/designs';
import { formatQuantity } from '@shared/units/index';

import { RequestFailureMessage, requestFailureOf, type RequestFailure } from '../ui/request-failure';
import { DesignsApi } from './designs-api';

/** What a chosen design file holds, as the preview shows it before anything is saved. */
interface Preview {
  fileName: string;
  file: DesignFile;
  lines: string[];
}

/** Largest design file read (a design file is a few kilobytes; the server takes JSON bodies up to its own limit). */
const MAX_FILE_BYTES = 1_000_000;

/** The preview's lines: the converter and, when the file has one, the construction. */
function describe(file: DesignFile): string[] {
  const c = file.spec.converter;
  const lines = [
    `${formatQuantity(c.vinMin, 'voltage')}–${formatQuantity(c.vinMax, 'voltage')} → ${formatQuantity(c.vout, 'voltage')}, ` +
      `${formatQuantity(c.ioutMax, 'current')} at ${formatQuantity(c.frequency, 'frequency')}, ${c.rectifier} rectifier`,
  ];
  const built = file.construction;
  lines.push(
    built
      ? `Construction: core ${built.coreId}, ${built.turns === 'auto' ? 'turns chosen by the engine' : `${built.turns} turns`}`
      : 'No construction: the design opens at its spec, ready for a search.',
  );
  return lines;
}

/**
 * A design file exported from Gapwright, read in the browser and checked with the same schema the server uses, shown
 * before it is imported; the import makes a new design (results recomputed by the server, never taken from the file).
 */
@Component({
  selector: 'gw-design-import',
  imports: [MatButtonModule, RequestFailureMessage],
  template: `
    <div class="gw-import">
      <input
        #picker
        class="gw-visually-hidden"
        type="file"
        accept=".json,application/json"
        aria-label="Design file (JSON)"
        (change)="choose(picker)"
      />
      <button mat-stroked-button type="button" [disabled]="busy()" (click)="picker.click()">Import a design file…</button>
      @if (problem(); as p) {
        <gw-request-failure [failure]="p" />
      }
      @if (preview(); as shown) {
        <div class="gw-preview" role="status">
          <p>
            <strong>{{ shown.file.title }}</strong> from {{ shown.fileName }}
          </p>
          @for (line of shown.lines; track $index) {
            <p>{{ line }}</p>
          }
          <button mat-flat-button type="button" [disabled]="busy()" (click)="importIt(shown.file)">Import as a new design</button>
          <button mat-button type="button" [disabled]="busy()" (click)="reset()">Cancel</button>
        </div>
      }
    </div>
  `,
  styles: `
    .gw-import {
      display: flex;
      flex-direction: column;
      align-items: flex-start;
      gap: 8px;
      margin: 8px 0 16px;
    }
    .gw-preview p {
      margin: 4px 0;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DesignImport {
  private readonly api = inject(DesignsApi);
  private readonly router = inject(Router);
  protected readonly preview = signal<Preview | null>(null);
  protected readonly problem = signal<RequestFailure | null>(null);
  protected readonly busy = signal(false);

  protected async choose(picker: HTMLInputElement): Promise<void> {
    const chosen = picker.files?.[0];
    picker.value = '';
    this.reset();
    if (!chosen) return;
    if (chosen.size > MAX_FILE_BYTES) {
      this.problem.set({ message: `${chosen.name} is ${Math.round(chosen.size / 1000)} kB; a design file is at most 1 MB.`, fields: [] });
      return;
    }
    let parsed: unknown;
    try {
      parsed = JSON.parse(await chosen.text());
    } catch (error) {
      this.problem.set({ message: `${chosen.name} is not JSON: ${error instanceof Error ? error.message : String(error)}`, fields: [] });
      return;
    }
    const checked = designFileSchema.safeParse(parsed);
    if (!checked.success) {
      this.problem.set({
        message: `${chosen.name} is not a Gapwright design file this version reads:`,
        fields: checked.error.issues.slice(0, 20).map((issue) => [issue.path.join('.') || 'file', issue.message]),
      });
      return;
    }
    this.preview.set({ fileName: chosen.name, file: checked.data, lines: describe(checked.data) });
  }

  protected importIt(file: DesignFile): void {
    this.busy.set(true);
    this.api.importFile(file).subscribe({
      next: (design) => {
        this.busy.set(false);
        void this.router.navigate(['/designs', design.id]);
      },
      error: (error: unknown) => {
        this.busy.set(false);
        this.problem.set(requestFailureOf(error));
      },
    });
  }

  protected reset(): void {
    this.preview.set(null);
    this.problem.set(null);
  }
}
