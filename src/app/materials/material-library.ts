import { DatePipe, DecimalPipe, DOCUMENT, PercentPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatDialog } from '@angular/material/dialog';
import { MatExpansionModule } from '@angular/material/expansion';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatMenuModule } from '@angular/material/menu';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSortModule } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { RouterLink } from '@angular/router';

import { Notifier } from '../core/notifier';
import { LibraryTable } from '../library/library-table';
import { RecordActions } from '../library/record-actions';
import { VersionHistory } from '../library/version-history';
import { QuantityPipe } from '../units/quantity';
import { ColumnChoice, localStorageOf, type ChoosableColumn } from './column-choice';
import { FittedRange } from './fitted-range';
import { MaterialEdit } from './material-edit';
import { MaterialUpload } from './material-upload';
import { MaterialsApi, type CommitResult, type LibraryMaterial } from './materials-api';
import { SignificantPipe } from '../units/significant';

/** The library's optional columns in table order; name, selection and actions are always shown. */
export const MATERIAL_COLUMNS: readonly ChoosableColumn[] = [
  { id: 'version', label: 'Version', shown: true },
  { id: 'family', label: 'Family', shown: true },
  { id: 'bsat25', label: 'Bsat at 25 °C', shown: true },
  { id: 'bsat100', label: 'Bsat at 100 °C', shown: true },
  { id: 'permeability', label: 'μi', shown: true },
  { id: 'lowestLoss', label: 'Temperature of lowest loss', shown: true },
  { id: 'frequencyRange', label: 'Fitted frequency range', shown: true },
  { id: 'fluxRange', label: 'Fitted flux range', shown: true },
  { id: 'lossPoints', label: 'Loss points', shown: true },
  { id: 'fitQuality', label: 'Fit quality', shown: true },
  { id: 'steinmetz', label: 'k · α · β', shown: true },
  { id: 'provenance', label: 'Provenance', shown: false },
  { id: 'createdBy', label: 'Added by', shown: false },
  { id: 'createdAt', label: 'Added', shown: false },
  { id: 'state', label: 'State', shown: true },
];
/** Where the choice of columns is kept in the browser. */
export const MATERIAL_COLUMNS_KEY = 'gapwright.material-library.columns';

@Component({
  selector: 'gw-material-library',
  imports: [
    DatePipe,
    SignificantPipe,
    DecimalPipe,
    FittedRange,
    LibraryTable,
    MatButtonModule,
    MatCheckboxModule,
    MatExpansionModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatMenuModule,
    MatProgressBarModule,
    MatSortModule,
    MatTableModule,
    MaterialUpload,
    PercentPipe,
    QuantityPipe,
    RecordActions,
    RouterLink,
    VersionHistory,
  ],
  templateUrl: './material-library.html',
  styleUrls: ['../library/library-page.scss', './material-library.scss'],
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class MaterialLibrary {
  private readonly api = inject(MaterialsApi);
  private readonly notifier = inject(Notifier);
  private readonly dialog = inject(MatDialog);

  /** The library, with what this user may do with each material (the server says so). */
  protected readonly library = this.api.libraryResource();
  protected readonly materials = computed(() => (this.library.hasValue() ? this.library.value().materials : []));
  protected readonly canImport = computed(() => this.library.hasValue() && this.library.value().canImport);
  protected readonly imports = this.api.importsResource();
  protected readonly columnChoice = new ColumnChoice(MATERIAL_COLUMNS, MATERIAL_COLUMNS_KEY, localStorageOf(inject(DOCUMENT).defaultView));
  protected readonly columns = computed(() => this.columnChoice.displayed(['select', 'name'], ['actions']));
  protected readonly historyColumns = ['steinmetz', 'fit', 'provenance'];
  protected readonly history = signal<{ lineage: string; name: string; versions: LibraryMaterial[] } | null>(null);
  protected readonly importColumns = ['uploadedAt', 'fileName', 'uploadedBy', 'counts'];
  protected readonly filterText = signal('');
  protected readonly selected = signal<ReadonlySet<string>>(new Set());
  protected readonly exportHref = computed(() => {
    const ids = [...this.selected()];
    return ids.length ? `/api/materials/export.csv?ids=${ids.join(',')}` : '/api/materials/export.csv';
  });

  protected readonly matches = (m: LibraryMaterial, filter: string) =>
    [m.name, m.family, m.provenance, m.createdBy ?? '', m.unitSet, m.retired ? 'retired' : 'in use']
      .join(' ')
      .toLowerCase()
      .includes(filter);

  protected readonly sortValue = (m: LibraryMaterial, column: string): string | number => {
    switch (column) {
      case 'steinmetz':
        return m.alpha;
      case 'frequencyRange':
        return m.fitFrequencyMin;
      case 'fluxRange':
        return m.fitFluxMin;
      // Versions without the figure sort after every one with it.
      case 'lowestLoss':
        return m.lowestLossTemperature ?? Number.MAX_VALUE;
      case 'lossPoints':
        return m.lossPointCount;
      case 'fitQuality':
        return m.fitQuality?.worstRelativeError ?? Number.MAX_VALUE;
      case 'state':
        return m.retired ? 1 : 0;
      default:
        return (m as unknown as Record<string, string | number>)[column] ?? '';
    }
  };

  protected toggle(id: string, on: boolean): void {
    this.selected.update((set) => {
      const next = new Set(set);
      if (on) next.add(id);
      else next.delete(id);
      return next;
    });
  }

  protected onImported(result: CommitResult): void {
    this.notifier.info(`Imported: ${result.created} new, ${result.versioned} new versions, ${result.skipped} skipped.`);
    this.library.reload();
    this.imports.reload();
  }

  protected showHistory(material: LibraryMaterial): void {
    this.api.history(material.id).subscribe((versions) => this.history.set({ lineage: material.lineage, name: material.name, versions }));
  }

  protected edit(material: LibraryMaterial): void {
    this.dialog
      .open<MaterialEdit, LibraryMaterial, LibraryMaterial>(MaterialEdit, { data: material, width: '880px', maxWidth: '95vw' })
      .afterClosed()
      .subscribe((saved) => {
        if (!saved) return;
        this.notifier.info(`Saved as version ${saved.version} of ${saved.name}`);
        this.library.reload();
        if (this.history()?.lineage === saved.lineage) this.showHistory(saved);
      });
  }

  protected setRetired(material: LibraryMaterial, retired: boolean): void {
    this.api.setRetired(material.id, retired).subscribe({
      next: () => {
        this.notifier.info(`${material.name} ${retired ? 'retired' : 'back in use'}.`);
        this.library.reload();
      },
      error: () => this.library.reload(),
    });
  }
}
