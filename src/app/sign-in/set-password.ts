import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { AbstractControl, FormControl, FormGroup, ReactiveFormsModule, ValidationErrors, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { ActivatedRoute, Router, RouterLink } from '@angular/router';

import { PASSWORD_LENGTH } from '@keepstitch/shared';

import { apiErrorOf, messageFor } from '../core/api-error';
import { Auth } from '../core/auth';
import { homeFor } from '../core/user';
import { applyServerFieldErrors } from '../ui/server-field-errors';
import { PasswordLinksApi } from './password-links-api';
import { FieldError } from '../ui/field-error';

function sameAsPassword(control: AbstractControl): ValidationErrors | null {
  const wanted = (control.parent as FormGroup | null)?.get('password')?.value as string | undefined;
  return control.value && wanted !== undefined && control.value !== wanted ? { mismatch: true } : null;
}

/**
 * The page a one-time link opens (an invitation or a reset): choose a
 * password, and be signed in to your own first page.
 */
@Component({
  selector: 'ks-set-password',
  imports: [ReactiveFormsModule, RouterLink, FieldError, MatCardModule, MatCheckboxModule, MatFormFieldModule, MatInputModule, MatButtonModule, MatIconModule, MatProgressBarModule],
  templateUrl: './set-password.html',
  styleUrl: './sign-in.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SetPassword {
  private readonly api = inject(PasswordLinksApi);
  private readonly auth = inject(Auth);
  private readonly router = inject(Router);

  protected readonly token = inject(ActivatedRoute).snapshot.queryParamMap.get('token') ?? '';
  protected readonly length = PASSWORD_LENGTH;
  protected readonly form = new FormGroup({
    password: new FormControl('', {
      nonNullable: true,
      validators: [Validators.required, Validators.minLength(PASSWORD_LENGTH.min), Validators.maxLength(PASSWORD_LENGTH.max)],
    }),
    repeatPassword: new FormControl('', { nonNullable: true, validators: [Validators.required, sameAsPassword] }),
  });
  protected readonly submitting = signal(false);
  protected readonly shown = signal(false);
  protected readonly serverError = signal<string | null>(null);

  constructor() {
    this.form.controls.password.valueChanges.subscribe(() => this.form.controls.repeatPassword.updateValueAndValidity({ emitEvent: false }));
  }

  protected choosePassword(): void {
    if (this.submitting()) return;
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    this.submitting.set(true);
    this.serverError.set(null);
    this.form.disable();
    this.api.setPassword(this.token, this.form.getRawValue().password).subscribe({
      next: (user) => {
        // The server has signed this browser in; reading it again also brings the new security token.
        void this.auth.load().then(() => this.router.navigateByUrl(homeFor(user.role)));
      },
      error: (error: unknown) => {
        this.submitting.set(false);
        this.form.enable();
        const fields = apiErrorOf(error)?.fields;
        const unmatched = applyServerFieldErrors(this.form, fields);
        this.serverError.set(unmatched.length ? unmatched.join(' ') : fields ? null : (apiErrorOf(error)?.message ?? messageFor(error)));
      },
    });
  }
}
