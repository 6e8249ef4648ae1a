import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, ElementRef, computed, inject, signal, viewChild } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatExpansionModule } from '@angular/material/expansion';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatPaginator, MatPaginatorModule } from '@angular/material/paginator';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { MatSort, MatSortModule } from '@angular/material/sort';
import { MatTableDataSource, MatTableModule } from '@angular/material/table';
import { formatIn, toDisplay } from '@shared/units/index';
import { may } from '@shared/api/permissions';

import { Notifier } from '../core/notifier';
import { Session } from '../core/session';
import { CoreForm } from './core-form';
import { CoreUpload } from './core-upload';
import { ShapedCoreForm } from './shaped-core-form';
import { CoresApi, type CatalogueCore, type CoreImportResult } from './cores-api';
import { bindTableSource } from '../core/table-binding';
import { QuantityPipe } from '../units/quantity';

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
    ShapedCoreForm,
    DatePipe,
    MatButtonModule,
    MatExpansionModule,
    MatFormFieldModule,
    MatInputModule,
    MatPaginatorModule,
    MatProgressBarModule,
    MatSelectModule,
    MatSortModule,
    MatTableModule,
    QuantityPipe,
  ],
  templateUrl: './core-catalogue.html',
  styleUrl: './core-catalogue.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CoreCatalogue {
  private readonly api = inject(CoresApi);
  private readonly notifier = inject(Notifier);
  private readonly session = inject(Session);
  private readonly sort = viewChild.required(MatSort);
  private readonly paginator = viewChild.required(MatPaginator);
  private readonly forms = viewChild.required('forms', { read: ElementRef<HTMLElement> });

  protected readonly cores = this.api.listResource();
  protected readonly families = computed(() => [...new Set(this.cores.value().map((c) => c.family))]);
  protected readonly columns = ['id', 'family', 'ae', 'le', 've', 'windowArea', 'areaProduct', 'origin', 'source', 'actions'];
  protected readonly historyColumns = ['version', 'ae', 'le', 've', 'windowArea', 'source', 'createdBy', 'createdAt'];
  protected readonly mayRetire = computed(() => may(this.session.role(), 'curate'));
  protected readonly mayEdit = computed(() => may(this.session.role(), 'upload'));
  /** The user core whose next version is being written in one of the forms above the table. */
  protected readonly editingCore = signal<CatalogueCore | null>(null);
  protected readonly editingRing = computed(() => (this.editingCore()?.ring ? this.editingCore() : null));
  protected readonly editingShape = computed(() => (this.editingCore() && !this.editingCore()!.ring ? this.editingCore() : null));
  protected readonly history = signal<{ name: string; userCoreId: number; versions: CatalogueCore[] } | null>(null);
  protected readonly dataSource = new MatTableDataSource<CatalogueCore>([]);
  protected readonly filters = signal<CoreFilters>({ text: '', family: '', aeMin: null, windowMin: null, apMin: null });

  constructor() {
    this.dataSource.filterPredicate = (core, serialised) => {
      const f = JSON.parse(serialised) as CoreFilters;
      if (f.family && core.family !== f.family) return false;
      if (f.aeMin !== null && toDisplay(core.ae, 'mm²') < f.aeMin) return false;
      if (f.windowMin !== null && toDisplay(core.windowArea, 'mm²') < f.windowMin) return false;
      if (f.apMin !== null && toDisplay(core.areaProduct, 'cm⁴') < f.apMin) return false;
      const text = f.text.trim().toLowerCase();
      return !text || [core.id, core.source, core.origin].join(' ').toLowerCase().includes(text);
    };
    bindTableSource(this.dataSource, () => this.cores.value(), this.sort, this.paginator);
  }

  protected setFilter(change: Partial<CoreFilters>): void {
    this.filters.update((f) => ({ ...f, ...change }));
    this.dataSource.filter = JSON.stringify(this.filters());
    this.dataSource.paginator?.firstPage();
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
    this.cores.reload();
    if (shown && core.userCoreId !== undefined && shown.name === core.id) this.showHistory(core);
  }

  protected edit(core: CatalogueCore): void {
    this.editingCore.set(core);
    (this.forms().nativeElement as HTMLElement).scrollIntoView?.({ block: 'start' });
  }

  protected importedCores(result: CoreImportResult): void {
    this.notifier.info(`${result.fileName}: ${result.created} cores added, ${result.versioned} new versions, ${result.skipped} skipped.`);
    this.cores.reload();
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
        this.cores.reload();
      },
      error: () => this.cores.reload(),
    });
  }
}
