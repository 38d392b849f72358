import { ChangeDetectionStrategy, Component, inject, signal, viewChild } from '@angular/core';
import { AbstractControl, FormControl, FormGroup, FormGroupDirective, ReactiveFormsModule, ValidationErrors, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';

import { PASSWORD_LENGTH } from '@keepstitch/shared';

import { apiErrorOf, messageFor } from '../core/api-error';
import { keepUnsavedWork } from '../core/unsaved-work';
import { applyServerFieldErrors } from '../ui/server-field-errors';
import { AccountApi } from './account-api';
import { FieldError } from '../ui/field-error';

/** The repeated password must match the new one. */
function sameAsNew(control: AbstractControl): ValidationErrors | null {
  const form = control.parent as FormGroup | null;
  const wanted = form?.get('newPassword')?.value as string | undefined;
  return control.value && wanted !== undefined && control.value !== wanted ? { mismatch: true } : null;
}

/** A signed-in person changes their own password. */
@Component({
  selector: 'ks-change-password',
  imports: [
    FieldError,
    ReactiveFormsModule,
    MatButtonModule,
    MatCardModule,
    MatCheckboxModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatProgressBarModule,
  ],
  templateUrl: './change-password.html',
  styleUrl: './change-password.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ChangePassword {
  private readonly api = inject(AccountApi);
  private readonly formDirective = viewChild.required(FormGroupDirective);

  protected readonly length = PASSWORD_LENGTH;
  protected readonly form = new FormGroup({
    currentPassword: new FormControl('', { nonNullable: true, validators: [Validators.required] }),
    newPassword: new FormControl('', {
      nonNullable: true,
      validators: [Validators.required, Validators.minLength(PASSWORD_LENGTH.min), Validators.maxLength(PASSWORD_LENGTH.max)],
    }),
    repeatPassword: new FormControl('', { nonNullable: true, validators: [Validators.required, sameAsNew] }),
  });
  protected readonly submitting = signal(false);
  protected readonly shown = signal(false);
  protected readonly serverError = signal<string | null>(null);
  protected readonly done = signal(false);

  constructor() {
    keepUnsavedWork(() => this.form.dirty);
    // Typing a new password again re-checks the repeat against it.
    this.form.controls.newPassword.valueChanges.subscribe(() => this.form.controls.repeatPassword.updateValueAndValidity({ emitEvent: false }));
  }

  protected save(): void {
    if (this.submitting()) {
      return;
    }
    this.done.set(false);
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const { currentPassword, newPassword } = this.form.getRawValue();
    this.submitting.set(true);
    this.serverError.set(null);
    this.form.disable();
    this.api.changePassword(currentPassword, newPassword).subscribe({
      next: () => {
        this.submitting.set(false);
        this.form.enable();
        // Through the directive, so the emptied fields are not shown as errors of a submitted form.
        this.formDirective().resetForm();
        this.done.set(true);
      },
      error: (error: unknown) => {
        this.submitting.set(false);
        this.form.enable();
        const unmatched = applyServerFieldErrors(this.form, apiErrorOf(error)?.fields);
        this.serverError.set(unmatched.length ? unmatched.join(' ') : apiErrorOf(error)?.fields ? null : messageFor(error));
      },
    });
  }
}
