import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatTableModule } from '@angular/material/table';
import { RouterLink } from '@angular/router';
import { endpointUrl } from '@shared/api/endpoint';
import { getOrder, orderSheetPdf } from '@shared/api/shop';

import { endpointResource } from '../core/api';
import { QuantityPipe } from '../units/quantity';
import { RecordUnitForm } from './record-unit-form';
import { WindingSheetView } from './winding-sheet-view';

const HIPOT_LABELS: Record<string, string> = { pass: 'Pass', fail: 'Fail', not_tested: 'Not tested' };

/** One build order: the winding sheet (printable, and as PDF), the units built so far, and the test record where the server allows it. */
@Component({
  selector: 'gw-order-page',
  imports: [
    DatePipe,
    MatButtonModule,
    MatIconModule,
    MatProgressBarModule,
    MatTableModule,
    QuantityPipe,
    RecordUnitForm,
    RouterLink,
    WindingSheetView,
  ],
  templateUrl: './order-page.html',
  styleUrl: './order-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class OrderPage {
  /** Route parameter. */
  readonly id = input.required<string>();

  private readonly resource = endpointResource(getOrder, () => ({ params: { id: this.id() } }));
  protected readonly order = computed(() => (this.resource.hasValue() ? this.resource.value() : null));
  protected readonly failed = computed(() => this.resource.status() === 'error');
  protected readonly pdfUrl = computed(() => endpointUrl(orderSheetPdf, { id: this.id() }));
  protected readonly passed = computed(() => this.order()?.units.filter((u) => u.passed).length ?? 0);
  protected readonly columns = ['unitNumber', 'inductance', 'resistance', 'hipot', 'result', 'findings', 'recordedAt'];
  protected readonly hipotLabels = HIPOT_LABELS;

  protected print(): void {
    window.print();
  }

  /** The server says again what the order now is and whether more units may be recorded. */
  protected added(): void {
    this.resource.reload();
  }
}
