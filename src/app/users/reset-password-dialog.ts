import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';

import { apiErrorOf, messageFor } from '../core/api-error';
import { UsersApi, minPasswordLength } from './users-api';

export interface ResetPasswordDialogData {
  id: number;
  name: string;
}

/** Sets a new password for someone; stays open (keeping the text) if the server refuses. */
@Component({
  selector: 'ks-reset-password-dialog',
  imports: [
    ReactiveFormsModule,
    MatDialogModule,
    MatButtonModule,
    MatFormFieldModule,
    MatInputModule,
    MatProgressBarModule,
  ],
  template: `
    <h2 mat-dialog-title>Reset password for {{ data.name }}</h2>
    <form [formGroup]="form" (ngSubmit)="setPassword()" novalidate>
      <mat-dialog-content>
        @if (saving()) {
          <mat-progress-bar mode="indeterminate" aria-label="Saving password" />
        }
        <p>Tell {{ data.name }} the new password in person or by phone, not by e-mail.</p>
        <mat-form-field>
          <mat-label>New password</mat-label>
          <input matInput type="password" formControlName="password" autocomplete="new-password" required />
          <mat-hint>At least {{ minLength }} characters</mat-hint>
          @if (password.hasError('required')) {
            <mat-error>Enter a new password</mat-error>
          } @else if (password.hasError('minlength')) {
            <mat-error>Use at least {{ minLength }} characters</mat-error>
          } @else if (password.hasError('server')) {
            <mat-error>{{ password.getError('server') }}</mat-error>
          }
        </mat-form-field>
        @if (error(); as message) {
          <p class="error" role="alert">{{ message }}</p>
        }
      </mat-dialog-content>
      <mat-dialog-actions align="end">
        <button mat-button type="button" mat-dialog-close>Cancel</button>
        <button mat-flat-button type="submit" [disabled]="saving()">Save new password</button>
      </mat-dialog-actions>
    </form>
  `,
  styles: `
    mat-form-field {
      width: 100%;
    }
    .error {
      color: var(--mat-sys-error);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ResetPasswordDialog {
  private readonly api = inject(UsersApi);
  private readonly dialogRef = inject<MatDialogRef<ResetPasswordDialog, boolean>>(MatDialogRef);
  protected readonly data = inject<ResetPasswordDialogData>(MAT_DIALOG_DATA);

  protected readonly minLength = minPasswordLength;
  protected readonly form = new FormGroup({
    password: new FormControl('', {
      nonNullable: true,
      validators: [Validators.required, Validators.minLength(minPasswordLength)],
    }),
  });
  protected readonly password = this.form.controls.password;
  protected readonly saving = signal(false);
  protected readonly error = signal<string | null>(null);

  protected setPassword(): void {
    if (this.saving()) {
      return;
    }
    if (this.password.invalid) {
      this.password.markAsTouched();
      return;
    }
    this.saving.set(true);
    this.error.set(null);
    this.api.setPassword(this.data.id, this.password.value).subscribe({
      next: () => this.dialogRef.close(true),
      error: (error: unknown) => {
        this.saving.set(false);
        const fieldMessage = apiErrorOf(error)?.fields?.['password'];
        if (fieldMessage) {
          this.password.setErrors({ server: fieldMessage });
        }
        this.error.set(messageFor(error));
      },
    });
  }
}
