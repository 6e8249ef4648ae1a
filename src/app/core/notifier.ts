import { Injectable, inject } from '@angular/core';
import { MatSnackBar } from '@angular/material/snack-bar';

/** Short messages at the bottom of the screen; errors stay until dismissed. */
@Injectable({ providedIn: 'root' })
export class Notifier {
  private readonly snackBar = inject(MatSnackBar);

  error(message: string): void {
    this.snackBar.open(message, 'Dismiss', { politeness: 'assertive' });
  }

  info(message: string): void {
    this.snackBar.open(message, 'OK', { duration: 5000, politeness: 'polite' });
  }
}
