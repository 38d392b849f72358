import { Injectable, inject } from '@angular/core';
import { MatSnackBar } from '@angular/material/snack-bar';

/** Short messages at the foot of the screen: confirmations and problems. */
@Injectable({ providedIn: 'root' })
export class Notices {
  private readonly snackBar = inject(MatSnackBar);

  info(message: string): void {
    this.snackBar.open(message, 'Close', { duration: 4000, politeness: 'polite' });
  }

  error(message: string): void {
    this.snackBar.open(message, 'Close', {
      duration: 8000,
      politeness: 'assertive',
      panelClass: 'ks-error-snackbar',
    });
  }
}
