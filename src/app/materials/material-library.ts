import { DatePipe, DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, signal, viewChild } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatDialog } from '@angular/material/dialog';
import { MatExpansionModule } from '@angular/material/expansion';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatPaginator, MatPaginatorModule } from '@angular/material/paginator';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSort, MatSortModule } from '@angular/material/sort';
import { MatTableDataSource, MatTableModule } from '@angular/material/table';
import { may } from '@shared/api/permissions';

import { Notifier } from '../core/notifier';
import { Session } from '../core/session';
import { MaterialEdit } from './material-edit';
import { MaterialUpload } from './material-upload';
import { MaterialsApi, type CommitResult, type LibraryMaterial } from './materials-api';
import { bindTableSource } from '../core/table-binding';
import { QuantityPipe } from '../units/quantity';

@Component({
  selector: 'gw-material-library',
  imports: [
    DatePipe,
    DecimalPipe,
    MatButtonModule,
    MatCheckboxModule,
    MatExpansionModule,
    MatFormFieldModule,
    MatInputModule,
    MatPaginatorModule,
    MatProgressBarModule,
    MatSortModule,
    MatTableModule,
    MaterialUpload,
    QuantityPipe,
  ],
  templateUrl: './material-library.html',
  styleUrl: './material-library.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class MaterialLibrary {
  private readonly api = inject(MaterialsApi);
  private readonly notifier = inject(Notifier);
  private readonly session = inject(Session);
  private readonly dialog = inject(MatDialog);
  private readonly sort = viewChild.required(MatSort);
  private readonly paginator = viewChild.required(MatPaginator);

  protected readonly materials = this.api.listResource();
  protected readonly imports = this.api.importsResource();
  /** Uploading and editing both add versions. */
  protected readonly mayAddVersions = computed(() => may(this.session.role(), 'upload'));
  protected readonly mayRetire = computed(() => may(this.session.role(), 'curate'));
  protected readonly columns = computed(() => [
    'select',
    'name',
    'family',
    'version',
    'steinmetz',
    'fit',
    'provenance',
    'createdBy',
    'createdAt',
    'state',
    'actions',
  ]);
  protected readonly historyColumns = ['version', 'steinmetz', 'fit', 'provenance', 'createdBy', 'createdAt'];
  protected readonly history = signal<{ lineage: string; name: string; versions: LibraryMaterial[] } | null>(null);
  protected readonly importColumns = ['uploadedAt', 'fileName', 'uploadedBy', 'counts'];
  protected readonly dataSource = new MatTableDataSource<LibraryMaterial>([]);
  protected readonly filterText = signal('');
  protected readonly selected = signal<ReadonlySet<string>>(new Set());
  protected readonly exportHref = computed(() => {
    const ids = [...this.selected()];
    return ids.length ? `/api/materials/export.csv?ids=${ids.join(',')}` : '/api/materials/export.csv';
  });

  constructor() {
    this.dataSource.filterPredicate = (m, filter) =>
      [m.name, m.family, m.provenance, m.createdBy ?? '', m.unitSet, m.retired ? 'retired' : 'in use']
        .join(' ')
        .toLowerCase()
        .includes(filter);
    this.dataSource.sortingDataAccessor = (m, column) => {
      switch (column) {
        case 'steinmetz':
          return m.alpha;
        case 'fit':
          return m.fitFrequencyMin;
        case 'state':
          return m.retired ? 1 : 0;
        default:
          return (m as unknown as Record<string, string | number>)[column] ?? '';
      }
    };
    bindTableSource(this.dataSource, () => this.materials.value(), this.sort, this.paginator);
  }

  protected applyFilter(text: string): void {
    this.filterText.set(text);
    this.dataSource.filter = text.trim().toLowerCase();
    this.dataSource.paginator?.firstPage();
  }

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
    this.materials.reload();
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
        this.materials.reload();
        if (this.history()?.lineage === saved.lineage) this.showHistory(saved);
      });
  }

  protected setRetired(material: LibraryMaterial, retired: boolean): void {
    this.api.setRetired(material.id, retired).subscribe({
      next: () => {
        this.notifier.info(`${material.name} ${retired ? 'retired' : 'back in use'}.`);
        this.materials.reload();
      },
      error: () => this.materials.reload(),
    });
  }
}
