import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { FormControl, ReactiveFormsModule } from '@angular/forms';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';

/** The name of a user core, with the messages both core forms give (the server's checks are the same). */
@Component({
  selector: 'gw-core-name-field',
  imports: [MatFormFieldModule, MatInputModule, ReactiveFormsModule],
  template: `
    <mat-form-field>
      <mat-label>Name</mat-label>
      <mat-hint>{{ hint() }}</mat-hint>
      <input matInput [formControl]="control()" autocomplete="off" required />
      @let name = control();
      @if (name.hasError('required')) {
        <mat-error>Enter a name</mat-error>
      } @else if (name.hasError('maxlength')) {
        <mat-error>At most 60 characters</mat-error>
      } @else if (name.hasError('pattern')) {
        <mat-error>Must not start with =, +, - or &#64;</mat-error>
      } @else if (name.hasError('server')) {
        <mat-error>{{ name.getError('server') }}</mat-error>
      }
    </mat-form-field>
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CoreNameField {
  readonly control = input.required<FormControl<string>>();
  readonly hint = input('');
}
