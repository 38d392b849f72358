import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';

import { apiErrorOf, messageFor } from '../core/api-error';
import { PasswordLinksApi } from './password-links-api';

/** "Forgot your password?": asks for a one-time link by e-mail. */
@Component({
  selector: 'ks-forgot-password',
  imports: [ReactiveFormsModule, RouterLink, MatCardModule, MatFormFieldModule, MatInputModule, MatButtonModule, MatIconModule, MatProgressBarModule],
  templateUrl: './forgot-password.html',
  styleUrl: './sign-in.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ForgotPassword {
  private readonly api = inject(PasswordLinksApi);

  protected readonly form = new FormGroup({
    email: new FormControl('', { nonNullable: true, validators: [Validators.required, Validators.email] }),
  });
  protected readonly submitting = signal(false);
  protected readonly serverError = signal<string | null>(null);
  protected readonly sent = signal<string | null>(null);

  protected requestLink(): void {
    if (this.submitting()) return;
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    this.submitting.set(true);
    this.serverError.set(null);
    this.form.disable();
    this.api.requestReset(this.form.getRawValue().email.trim()).subscribe({
      next: (message) => {
        this.submitting.set(false);
        this.sent.set(message);
      },
      error: (error: unknown) => {
        this.submitting.set(false);
        this.form.enable();
        this.serverError.set(apiErrorOf(error)?.message ?? messageFor(error));
      },
    });
  }
}
