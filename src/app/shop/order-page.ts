import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, input, signal, effect } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatTableModule } from '@angular/material/table';
import { RouterLink } from '@angular/router';
import { may } from '@shared/api/permissions';
import { microhenry, milliohm, kilohertz } from '@shared/shop/sheet-text';

import { Session } from '../core/session';
import { RecordUnitForm } from './record-unit-form';
import { ShopApi, type BuildOrder, type RecordedUnit } from './shop-api';
import { WindingSheetView } from './winding-sheet-view';

const HIPOT_LABELS: Record<string, string> = { pass: 'Pass', fail: 'Fail', not_tested: 'Not tested' };

/** One build order: the winding sheet (printable, and as PDF), the units built so far, and for winders the test record. */
@Component({
  selector: 'gw-order-page',
  imports: [DatePipe, MatButtonModule, MatIconModule, MatProgressBarModule, MatTableModule, RecordUnitForm, RouterLink, WindingSheetView],
  templateUrl: './order-page.html',
  styleUrl: './order-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class OrderPage {
  private readonly api = inject(ShopApi);
  private readonly session = inject(Session);

  /** Route parameter. */
  readonly id = input.required<string>();

  protected readonly order = signal<BuildOrder | null>(null);
  protected readonly failed = signal(false);
  protected readonly orderId = computed(() => Number(this.id()));
  protected readonly pdfUrl = computed(() => this.api.pdfUrl(this.orderId()));
  protected readonly mayBuild = computed(() => may(this.session.role(), 'build'));
  protected readonly passed = computed(() => this.order()?.units.filter((u) => u.passed).length ?? 0);
  protected readonly columns = ['unitNumber', 'inductance', 'resistance', 'hipot', 'result', 'findings', 'recordedAt'];
  protected readonly hipotLabels = HIPOT_LABELS;
  protected readonly microhenry = microhenry;
  protected readonly milliohm = milliohm;
  protected readonly kilohertz = kilohertz;

  constructor() {
    effect(() => this.load(this.orderId()));
  }

  protected print(): void {
    window.print();
  }

  protected added(recorded: RecordedUnit): void {
    this.order.update((order) => (order ? { ...order, status: recorded.orderStatus, units: [...order.units, recorded.unit] } : order));
  }

  protected temperature(value: number): string {
    return `${Number(value.toPrecision(3))} °C`;
  }

  private load(id: number): void {
    this.api.order(id).subscribe({
      next: (order) => this.order.set(order),
      error: () => this.failed.set(true),
    });
  }
}
