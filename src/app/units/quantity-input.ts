import {
  ChangeDetectionStrategy,
  ChangeDetectorRef,
  Component,
  DestroyRef,
  computed,
  inject,
  input,
  signal,
  type OnInit,
} from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import {
  type AbstractControl,
  type ControlValueAccessor,
  FormControl,
  NgControl,
  ReactiveFormsModule,
  type ValidationErrors,
  type ValidatorFn,
} from '@angular/forms';
import { ErrorStateMatcher } from '@angular/material/core';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { formatQuantity, parseQuantity, readLoosely, type QuantityKind } from '@shared/units/index';

let nextId = 0;

/**
 * A number field that reads what people type with units and prefixes ("4.7 uH", "250kHz", "85 °C") and gives the
 * form the SI value. A value of the wrong kind ("3 A" in a voltage field) is an error under the field. On leaving
 * the field the value is shown back in engineering notation.
 */
@Component({
  selector: 'gw-quantity-input',
  imports: [MatFormFieldModule, MatInputModule, ReactiveFormsModule],
  template: `
    <mat-form-field class="gw-quantity" [subscriptSizing]="'dynamic'">
      <mat-label>{{ label() }}</mat-label>
      <input
        matInput
        [id]="inputId"
        [formControl]="inner"
        [placeholder]="placeholder()"
        [required]="required()"
        [errorStateMatcher]="matcher"
        [attr.aria-invalid]="showError() ? 'true' : null"
        autocomplete="off"
        spellcheck="false"
        (blur)="left()"
      />
      @if (showError()) {
        <mat-error>{{ message() }}</mat-error>
      } @else if (warning()) {
        <mat-hint class="gw-field-warning">{{ warning() }}</mat-hint>
      } @else if (readAs()) {
        <mat-hint class="gw-read-as">{{ readAs() }}</mat-hint>
      } @else if (hint()) {
        <mat-hint>{{ hint() }}</mat-hint>
      }
    </mat-form-field>
  `,
  styles: `
    :host {
      display: block;
    }
    .gw-quantity {
      width: 100%;
    }
    .gw-field-warning {
      color: var(--mat-sys-tertiary);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class QuantityInput implements ControlValueAccessor, OnInit {
  private readonly ngControl = inject(NgControl, { self: true, optional: true });
  private readonly destroyRef = inject(DestroyRef);
  private readonly changeDetector = inject(ChangeDetectorRef);

  readonly label = input.required<string>();
  readonly kind = input.required<QuantityKind>();
  readonly placeholder = input('');
  readonly hint = input('');
  /** A caution about the value as it stands (e.g. against another field), shown under it while there is no error. */
  readonly warning = input('');
  readonly required = input(false);
  /** Inclusive limits in SI; messages show them in engineering notation. */
  readonly min = input<number | undefined>(undefined);
  readonly max = input<number | undefined>(undefined);

  protected readonly inputId = `gw-quantity-${nextId++}`;
  /** The text as typed; the field's own control, so the form field can show its error state. */
  protected readonly inner = new FormControl('', { nonNullable: true });
  protected readonly text = signal('');
  private readonly touched = signal(false);
  /** Errors the form put on the control from outside (e.g. the server's field message). */
  private readonly outsideError = signal<string | null>(null);

  private readonly parsed = computed(() => (this.text().trim() ? parseQuantity(this.text(), this.kind()) : null));
  /** A decimal comma or a prefix shorthand is read, never silently: the field says what it took the text for. */
  protected readonly readAs = computed(() => {
    const result = this.parsed();
    const text = this.text();
    if (!result?.ok || !readLoosely(text)) return '';
    return `Read as ${formatQuantity(result.value, this.kind())}`;
  });
  protected readonly message = computed(() => this.ownError() ?? this.outsideError() ?? '');
  protected readonly showError = computed(() => this.touched() && this.message() !== '');
  protected readonly matcher: ErrorStateMatcher = { isErrorState: () => this.showError() };

  private onChange: (value: number | null) => void = () => {};
  private onTouched: () => void = () => {};
  private readonly validator: ValidatorFn = () => this.validate();

  constructor() {
    if (this.ngControl) this.ngControl.valueAccessor = this;
    this.inner.valueChanges.pipe(takeUntilDestroyed()).subscribe((text) => this.typed(text));
  }

  ngOnInit(): void {
    const control = this.ngControl?.control;
    if (!control) return;
    control.addValidators(this.validator);
    queueMicrotask(() => control.updateValueAndValidity({ emitEvent: false }));
    // Touched and outside errors (the server's message for this field) come from the form control.
    const subscription = control.events.subscribe(() => this.syncFrom(control));
    this.destroyRef.onDestroy(() => {
      subscription.unsubscribe();
      control.removeValidators(this.validator);
    });
  }

  private syncFrom(control: AbstractControl): void {
    if (control.touched) this.touched.set(true);
    if (control.pristine && control.untouched) this.touched.set(false);
    const server = control.errors?.['server'];
    this.outsideError.set(typeof server === 'string' ? server : null);
  }

  private ownError(): string | null {
    const result = this.parsed();
    if (result === null) return this.required() ? `${this.label()} is required` : null;
    if (!result.ok) return result.error;
    const min = this.min();
    const max = this.max();
    if (min !== undefined && result.value < min) return `At least ${formatQuantity(min, this.kind())}`;
    if (max !== undefined && result.value > max) return `At most ${formatQuantity(max, this.kind())}`;
    return null;
  }

  private typed(text: string): void {
    this.text.set(text);
    this.outsideError.set(null);
    const result = this.parsed();
    this.onChange(result?.ok ? result.value : null);
  }

  protected left(): void {
    this.touched.set(true);
    this.onTouched();
    const result = this.parsed();
    if (result?.ok && !this.ownError()) this.show(formatQuantity(result.value, this.kind()));
  }

  writeValue(value: number | null | undefined): void {
    this.show(value === null || value === undefined || !Number.isFinite(value) ? '' : formatQuantity(value, this.kind()));
  }

  private show(text: string): void {
    this.text.set(text);
    this.inner.setValue(text, { emitEvent: false });
    // The form wrote from outside: the field (label float, error state) must look at the new text.
    this.changeDetector.markForCheck();
  }

  registerOnChange(fn: (value: number | null) => void): void {
    this.onChange = fn;
  }

  registerOnTouched(fn: () => void): void {
    this.onTouched = fn;
  }

  setDisabledState(disabled: boolean): void {
    if (disabled) this.inner.disable({ emitEvent: false });
    else this.inner.enable({ emitEvent: false });
  }

  private validate(): ValidationErrors | null {
    const own = this.ownError();
    return own ? { quantity: own } : null;
  }
}
