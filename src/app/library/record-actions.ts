import { ChangeDetectionStrategy, Component, input, output } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import type { RecordActions as Allowed } from '@shared/schemas/record-actions';

/**
 * The buttons of one library row: its versions, and the edit, retire or restore the server says this user
 * may do with it (the flags of the answer; the page works out no roles or states).
 */
@Component({
  selector: 'gw-record-actions',
  imports: [MatButtonModule],
  template: `
    <button mat-button type="button" [attr.aria-label]="'Versions of ' + name()" (click)="history.emit()">Versions</button>
    @if (allowed().canEdit) {
      <button mat-stroked-button type="button" [attr.aria-label]="'Edit ' + name()" (click)="edit.emit()">Edit</button>
    }
    @if (allowed().canRetire) {
      <button mat-stroked-button type="button" [attr.aria-label]="'Retire ' + name()" (click)="retire.emit(true)">Retire</button>
    }
    @if (allowed().canRestore) {
      <button mat-stroked-button type="button" [attr.aria-label]="'Restore ' + name()" (click)="retire.emit(false)">Restore</button>
    }
  `,
  styles: `
    :host {
      white-space: nowrap;
    }

    button + button {
      margin-left: 4px;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RecordActions {
  /** The row's name, for the buttons' accessible names ("Edit Demo ferrite…"). */
  readonly name = input.required<string>();
  readonly allowed = input.required<Allowed>();
  readonly history = output();
  readonly edit = output();
  /** true: retire, false: restore. */
  readonly retire = output<boolean>();
}
