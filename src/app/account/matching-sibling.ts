import type { AbstractControl, ValidationErrors, ValidatorFn } from '@angular/forms';

/** The confirmation field must repeat the sibling field named `siblingName`. */
export function matchingSibling(siblingName: string): ValidatorFn {
  return (control: AbstractControl): ValidationErrors | null => {
    const sibling = control.parent?.get(siblingName);
    if (!sibling || !control.value) return null;
    return control.value === sibling.value ? null : { mismatch: true };
  };
}
