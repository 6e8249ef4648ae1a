import { Directive, effect, inject, input, output, signal, untracked } from '@angular/core';
import type { FormGroup } from '@angular/forms';
import type { UserCoreRequest } from '@shared/schemas/cores';

import { showServerFieldErrors } from '../core/server-field-errors';
import { CoresApi, type CatalogueCore } from './cores-api';

/** What the ring and the gapped core forms share: adding a core, or saving the next version of the one being edited. */
@Directive()
export abstract class UserCoreForm {
  private readonly api = inject(CoresApi);
  /** A user core of this form's kind to save a new version of (the page decides the kind); null adds a new core. */
  readonly editing = input<CatalogueCore | null>(null);
  readonly created = output<CatalogueCore>();
  readonly cancelled = output<void>();
  protected readonly submitting = signal(false);
  protected readonly failure = signal<string | null>(null);
  protected abstract readonly form: FormGroup;
  /** The form holds an edited core's values, so leaving the edit empties it. */
  private filled = false;

  constructor() {
    effect(() => {
      const core = this.editing();
      untracked(() => {
        if (core) {
          this.filled = true;
          this.fill(core);
        } else if (this.filled) {
          this.empty();
        }
      });
    });
  }

  /** The stored core's values in the form's units. */
  protected abstract fill(core: CatalogueCore): void;
  /** The form's fields back to their starting values. */
  protected abstract clear(): void;

  private empty(): void {
    this.filled = false;
    this.clear();
  }

  protected send(request: UserCoreRequest): void {
    this.submitting.set(true);
    this.failure.set(null);
    const editing = this.editing();
    const saved = editing?.userCoreId !== undefined ? this.api.edit(editing.userCoreId, request) : this.api.create(request);
    saved.subscribe({
      next: (core) => {
        this.submitting.set(false);
        this.empty();
        this.created.emit(core);
      },
      error: (error: unknown) => {
        this.submitting.set(false);
        this.failure.set(showServerFieldErrors(this.form, error));
      },
    });
  }
}
