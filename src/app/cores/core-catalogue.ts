import { ChangeDetectionStrategy, Component, ElementRef, computed, inject, signal, viewChild } from '@angular/core';
import { MatExpansionModule } from '@angular/material/expansion';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { MatSortModule } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { formatIn, toDisplay } from '@shared/units/index';

import { Notifier } from '../core/notifier';
import { LibraryTable } from '../library/library-table';
import { RecordActions } from '../library/record-actions';
import { VersionHistory } from '../library/version-history';
import { QuantityPipe } from '../units/quantity';
import { CoreForm } from './core-form';
import { CoreUpload } from './core-upload';
import { CoresApi, type CatalogueCore, type CoreImportResult } from './cores-api';
import { AREA_PRODUCT_COLUMN, DIMENSION_COLUMNS, dimensionOf } from './dimension-columns';
import { ShapedCoreForm } from './shaped-core-form';

interface CoreFilters {
  text: string;
  family: string;
  aeMin: number | null;
  windowMin: number | null;
  apMin: number | null;
}

@Component({
  selector: 'gw-core-catalogue',
  imports: [
    CoreForm,
    CoreUpload,
    LibraryTable,
    MatExpansionModule,
    MatFormFieldModule,
    MatInputModule,
    MatProgressBarModule,
    MatSelectModule,
    MatSortModule,
    MatTableModule,
    QuantityPipe,
    RecordActions,
    ShapedCoreForm,
    VersionHistory,
  ],
  templateUrl: './core-catalogue.html',
  styleUrls: ['../library/library-page.scss', './core-catalogue.scss'],
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CoreCatalogue {
  private readonly api = inject(CoresApi);
  private readonly notifier = inject(Notifier);
  private readonly forms = viewChild.required('forms', { read: ElementRef<HTMLElement> });

  /** Shipped and user cores, with what this user may do with each (the server says so). */
  protected readonly catalogue = this.api.listResource();
  protected readonly cores = computed(() => (this.catalogue.hasValue() ? this.catalogue.value() : []));
  protected readonly families = computed(() => [...new Set(this.cores().map((c) => c.family))]);
  protected readonly tableDimensions = [...DIMENSION_COLUMNS, AREA_PRODUCT_COLUMN];
  protected readonly historyDimensions = DIMENSION_COLUMNS;
  protected readonly dimensionOf = dimensionOf;
  protected readonly columns = ['id', 'family', ...this.tableDimensions.map((c) => c.field), 'origin', 'source', 'actions'];
  protected readonly historyColumns = [...this.historyDimensions.map((c) => c.field), 'source'];
  /** The user core whose next version is being written in one of the forms above the table. */
  protected readonly editingCore = signal<CatalogueCore | null>(null);
  protected readonly editingRing = computed(() => (this.editingCore()?.ring ? this.editingCore() : null));
  protected readonly editingShape = computed(() => (this.editingCore() && !this.editingCore()!.ring ? this.editingCore() : null));
  protected readonly history = signal<{ name: string; userCoreId: number; versions: CatalogueCore[] } | null>(null);
  protected readonly filters = signal<CoreFilters>({ text: '', family: '', aeMin: null, windowMin: null, apMin: null });
  /** The filters as the table's filter text: empty (every core) until one is set. */
  protected readonly filterKey = signal('');

  protected readonly matches = (core: CatalogueCore, serialised: string) => {
    const f = JSON.parse(serialised) as CoreFilters;
    if (f.family && core.family !== f.family) return false;
    if (f.aeMin !== null && toDisplay(core.ae, 'mm²') < f.aeMin) return false;
    if (f.windowMin !== null && toDisplay(core.windowArea, 'mm²') < f.windowMin) return false;
    if (f.apMin !== null && toDisplay(core.areaProduct, 'cm⁴') < f.apMin) return false;
    const text = f.text.trim().toLowerCase();
    return !text || [core.id, core.source, core.origin].join(' ').toLowerCase().includes(text);
  };

  protected setFilter(change: Partial<CoreFilters>): void {
    this.filters.update((f) => ({ ...f, ...change }));
    this.filterKey.set(JSON.stringify(this.filters()));
  }

  protected numberOrNull(text: string): number | null {
    const value = Number(text);
    return text.trim() === '' || !Number.isFinite(value) ? null : value;
  }

  protected added(core: CatalogueCore): void {
    const what = core.version && core.version > 1 ? `saved as version ${core.version}` : 'added';
    this.notifier.info(`Core ${core.id} ${what}: le ${formatIn(core.le, 'mm')}, Ae ${formatIn(core.ae, 'mm²')}.`);
    const shown = this.history();
    this.editingCore.set(null);
    this.catalogue.reload();
    if (shown && core.userCoreId !== undefined && shown.name === core.id) this.showHistory(core);
  }

  protected edit(core: CatalogueCore): void {
    this.editingCore.set(core);
    (this.forms().nativeElement as HTMLElement).scrollIntoView?.({ block: 'start' });
  }

  protected importedCores(result: CoreImportResult): void {
    this.notifier.info(`${result.fileName}: ${result.created} cores added, ${result.versioned} new versions, ${result.skipped} skipped.`);
    this.catalogue.reload();
  }

  protected showHistory(core: CatalogueCore): void {
    if (core.userCoreId === undefined) return;
    const userCoreId = core.userCoreId;
    this.api.history(userCoreId).subscribe((versions) => this.history.set({ name: core.id, userCoreId, versions }));
  }

  protected setRetired(core: CatalogueCore, retired: boolean): void {
    if (core.userCoreId === undefined) return;
    this.api.setRetired(core.userCoreId, retired).subscribe({
      next: () => {
        this.notifier.info(
          retired ? `${core.id} retired: new searches leave it out, designs that use it keep it.` : `${core.id} is back in use.`,
        );
        this.catalogue.reload();
      },
      error: () => this.catalogue.reload(),
    });
  }
}
