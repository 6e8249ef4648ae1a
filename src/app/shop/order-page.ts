import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatTableModule } from '@angular/material/table';
import { RouterLink } from '@angular/router';
import { endpointUrl } from '@shared/api/endpoint';
import { getOrder, orderSheetPdf } from '@shared/api/shop';
import type { BuiltUnit, RecordedUnit } from '@shared/schemas/shop';

import { endpointResource } from '../core/api';
import { QuantityPipe } from '../units/quantity';
import { RecordUnitForm } from './record-unit-form';
import { VoidUnitDialog, type VoidUnitDialogData } from './void-unit-dialog';
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
  private readonly dialog = inject(MatDialog);

  private readonly resource = endpointResource(getOrder, () => ({ params: { id: this.id() } }));
  protected readonly order = computed(() => (this.resource.hasValue() ? this.resource.value() : null));
  protected readonly failed = computed(() => this.resource.status() === 'error');
  protected readonly pdfUrl = computed(() => endpointUrl(orderSheetPdf, { id: this.id() }));
  /** Records that stand: voided ones stay in the table, struck through, and count for nothing. */
  private readonly standing = computed(() => this.order()?.units.filter((u) => u.voidedAt === null) ?? []);
  protected readonly passed = computed(() => this.standing().filter((u) => u.passed).length);
  protected readonly built = computed(() => this.standing().length);
  /** Voided unit numbers with no record standing: each may be recorded again. */
  protected readonly recordAgain = computed(() => {
    const standing = new Set(this.standing().map((u) => u.unitNumber));
    const voided = (this.order()?.units ?? []).filter((u) => u.voidedAt !== null && !standing.has(u.unitNumber));
    return [...new Set(voided.map((u) => u.unitNumber))];
  });
  /** The voided unit number the form records again; null for the next unit. */
  protected readonly againNumber = signal<number | null>(null);
  protected readonly columns = ['unitNumber', 'inductance', 'resistance', 'hipot', 'result', 'findings', 'recordedAt', 'actions'];
  protected readonly hipotLabels = HIPOT_LABELS;

  protected print(): void {
    window.print();
  }

  /** The server says again what the order now is and whether more units may be recorded. */
  protected added(): void {
    this.againNumber.set(null);
    this.resource.reload();
  }

  protected voidRecord(unit: BuiltUnit, orderNumber: string): void {
    const data: VoidUnitDialogData = { unitId: unit.id, subject: `unit ${unit.unitNumber} of ${orderNumber}` };
    this.dialog
      .open<VoidUnitDialog, VoidUnitDialogData, RecordedUnit>(VoidUnitDialog, { data, width: '520px', maxWidth: '95vw' })
      .afterClosed()
      .subscribe((outcome) => {
        if (outcome) this.resource.reload();
      });
  }
}
